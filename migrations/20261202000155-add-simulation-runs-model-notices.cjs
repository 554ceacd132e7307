'use strict';

// What the registers → model export left out of a run's model or changed on its way in (closed
// risks and their correlations, occurred risks counted as certain), in words a user reads, so the
// run page can say so later. Null for runs from before it was recorded.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'modelNotices', {
      type: Sequelize.JSON,
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'modelNotices');
  },
};

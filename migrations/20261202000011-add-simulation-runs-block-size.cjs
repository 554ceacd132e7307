'use strict';

// The block size (iterations per block) each run was computed with: blocks are the unit a run's
// numbers are drawn in, so another size gives other numbers. Null for runs from before it was
// recorded.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'blockSize', {
      type: Sequelize.INTEGER,
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'blockSize');
  },
};

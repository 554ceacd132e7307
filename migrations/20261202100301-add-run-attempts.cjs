'use strict';

// How many times a worker has started the run: a run whose worker died is started again,
// up to a limit, then failed with a reason.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'attempts', {
      type: Sequelize.INTEGER.UNSIGNED,
      allowNull: false,
      defaultValue: 0,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'attempts');
  },
};

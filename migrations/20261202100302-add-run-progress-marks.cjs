'use strict';

// The first and the latest progress report of a running run ({ at, done } each), so that any
// web instance can estimate the time left, not only the process that executes the run.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'progressMarks', {
      type: Sequelize.JSON,
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'progressMarks');
  },
};

'use strict';

// The claim of the attempt that executes a run: its progress and final writes are made only
// while the row still names it, so a retried or late duplicate attempt cannot write twice.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'attemptToken', {
      type: Sequelize.CHAR(36),
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'attemptToken');
  },
};

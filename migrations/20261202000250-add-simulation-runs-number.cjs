'use strict';

// A run's number within its project (Run 1 is a project's first run), the number every screen,
// brief and mail names it by; the internal id stays in URLs only. Filled by the next migration.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'number', {
      type: Sequelize.INTEGER.UNSIGNED,
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'number');
  },
};

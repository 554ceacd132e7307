'use strict';

// One run per number in a project: two runs started at once cannot both become "Run 4".
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('SimulationRuns', ['projectId', 'number'], {
      unique: true,
      name: 'simulation_runs_project_number',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('SimulationRuns', 'simulation_runs_project_number');
  },
};

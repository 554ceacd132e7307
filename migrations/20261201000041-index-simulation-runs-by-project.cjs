'use strict';

// The runs history lists a project's runs newest first.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('SimulationRuns', ['projectId', 'createdAt'], {
      name: 'run_project_created',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('SimulationRuns', 'run_project_created');
  },
};

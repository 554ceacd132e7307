'use strict';

// The projects page shows each project's latest succeeded run: MAX(id) per project among an
// organisation's succeeded runs. This index answers it from the index alone, a few entries per
// project, instead of visiting every succeeded run of the organisation.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('SimulationRuns', ['organizationId', 'status', 'projectId', 'id'], {
      name: 'run_org_status_project',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('SimulationRuns', 'run_org_status_project');
  },
};

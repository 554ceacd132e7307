'use strict';

// The queue counts an organisation's queued and running runs; recovery finds the running ones.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('SimulationRuns', ['organizationId', 'status'], { name: 'run_org_status' });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('SimulationRuns', 'run_org_status');
  },
};

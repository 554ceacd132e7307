'use strict';

// The trend and the decision history read a project's decisions in date order.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('Approvals', ['projectId', 'createdAt'], {
      name: 'approval_project_created',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('Approvals', 'approval_project_created');
  },
};

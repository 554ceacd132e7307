'use strict';

// The audit trail is read newest first, a page at a time (ORDER BY id DESC, id < before) within a
// project: this index serves that read without sorting the project's whole trail.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('AuditEntries', ['projectId', 'id'], { name: 'audit_entries_project_id' });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('AuditEntries', 'audit_entries_project_id');
  },
};

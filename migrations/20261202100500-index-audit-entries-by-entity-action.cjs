'use strict';

// The projects page asks for an organisation's briefs sent for a decision (entity and action,
// newest first): without this index that read walks the whole audit trail of every organisation.
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('AuditEntries', ['organizationId', 'entity', 'action', 'id'], {
      name: 'audit_entries_org_entity_action',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('AuditEntries', 'audit_entries_org_entity_action');
  },
};

'use strict';

// The outbox: every e-mail is written here in the same transaction as the action that
// caused it, then sent (and retried) by the sender in the server process.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'OutboundMessages',
      {
        id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
        kind: { type: Sequelize.STRING(40), allowNull: false },
        userId: {
          type: Sequelize.INTEGER,
          allowNull: true,
          references: { model: 'Users', key: 'id' },
          onDelete: 'SET NULL',
        },
        toAddress: { type: Sequelize.STRING(254), allowNull: false },
        subject: { type: Sequelize.STRING(250), allowNull: false },
        html: { type: Sequelize.TEXT, allowNull: false },
        text: { type: Sequelize.TEXT, allowNull: false },
        status: {
          type: Sequelize.ENUM('pending', 'sent', 'failed'),
          allowNull: false,
          defaultValue: 'pending',
        },
        attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
        lastError: { type: Sequelize.STRING(1000), allowNull: true },
        nextAttemptAt: { type: Sequelize.DATE, allowNull: false },
        sentAt: { type: Sequelize.DATE, allowNull: true },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      {
        // The sender reads "pending, due now" on every poll.
        indexes: [{ name: 'outbound_messages_due', fields: ['status', 'nextAttemptAt'] }],
      },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('OutboundMessages');
  },
};

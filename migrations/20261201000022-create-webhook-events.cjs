'use strict';

// Ids of the payment-service events already applied, so that a redelivered event changes nothing.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('WebhookEvents', {
      id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
      eventId: { type: Sequelize.STRING(80), allowNull: false, unique: true },
      type: { type: Sequelize.STRING(80), allowNull: false },
      organizationId: {
        type: Sequelize.INTEGER,
        allowNull: true,
        references: { model: 'Organizations', key: 'id' },
        onDelete: 'SET NULL',
      },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('WebhookEvents');
  },
};

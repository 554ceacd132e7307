'use strict';

// One subscription per organisation, mirrored from the payment service's webhooks.
// A trial has no payment-service ids yet.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('Subscriptions', {
      id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: {
        type: Sequelize.INTEGER,
        allowNull: false,
        unique: true,
        references: { model: 'Organizations', key: 'id' },
        onDelete: 'CASCADE',
      },
      status: {
        type: Sequelize.ENUM(
          'trialing',
          'active',
          'past_due',
          'unpaid',
          'incomplete',
          'incomplete_expired',
          'canceled',
        ),
        allowNull: false,
      },
      seats: { type: Sequelize.INTEGER, allowNull: false },
      unitAmount: { type: Sequelize.INTEGER, allowNull: true },
      currency: { type: Sequelize.STRING(3), allowNull: true },
      stripeCustomerId: { type: Sequelize.STRING(64), allowNull: true, unique: true },
      stripeSubscriptionId: { type: Sequelize.STRING(64), allowNull: true, unique: true },
      trialEndsAt: { type: Sequelize.DATE, allowNull: true },
      currentPeriodEnd: { type: Sequelize.DATE, allowNull: true },
      cancelAtPeriodEnd: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      endedAt: { type: Sequelize.DATE, allowNull: true },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Subscriptions');
  },
};

'use strict';

// Invoices mirrored from the payment service (amounts in the currency's minor unit).
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('Invoices', {
      id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: {
        type: Sequelize.INTEGER,
        allowNull: false,
        references: { model: 'Organizations', key: 'id' },
        onDelete: 'CASCADE',
      },
      stripeInvoiceId: { type: Sequelize.STRING(64), allowNull: false, unique: true },
      number: { type: Sequelize.STRING(64), allowNull: true },
      status: { type: Sequelize.STRING(24), allowNull: false },
      billingReason: { type: Sequelize.STRING(40), allowNull: true },
      total: { type: Sequelize.INTEGER, allowNull: false },
      amountPaid: { type: Sequelize.INTEGER, allowNull: false },
      currency: { type: Sequelize.STRING(3), allowNull: false },
      periodStart: { type: Sequelize.DATE, allowNull: true },
      periodEnd: { type: Sequelize.DATE, allowNull: true },
      issuedAt: { type: Sequelize.DATE, allowNull: false },
      paidAt: { type: Sequelize.DATE, allowNull: true },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Invoices');
  },
};

'use strict';
// The demo organisation pays for 5 seats (it has 2 paid members: its owner and estimator),
// 10 days into a 30-day period, with its first invoice paid. The ids match the objects that
// the local payment fake (scripts/fakes/payments.ts) holds from its start.
const { QueryTypes } = require('sequelize');
const { ORGANIZATION } = require('./data/demo-accounts.cjs');
const DEMO = require('./data/demo-billing.json');

const DAY = 24 * 3600 * 1000;
const UNIT_AMOUNT = 4900;

module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const periodStart = new Date(now.getTime() - 10 * DAY);
    const periodEnd = new Date(periodStart.getTime() + 30 * DAY);
    await queryInterface.sequelize.transaction(async (transaction) => {
      const [org] = await queryInterface.sequelize.query(
        'SELECT id FROM Organizations WHERE name = ? ORDER BY id LIMIT 1',
        { replacements: [ORGANIZATION], type: QueryTypes.SELECT, transaction },
      );
      if (!org) return;
      await queryInterface.bulkInsert(
        'Subscriptions',
        [
          {
            organizationId: org.id,
            status: 'active',
            seats: DEMO.seats,
            unitAmount: UNIT_AMOUNT,
            currency: 'eur',
            stripeCustomerId: DEMO.customer,
            stripeSubscriptionId: DEMO.subscription,
            trialEndsAt: null,
            currentPeriodEnd: periodEnd,
            cancelAtPeriodEnd: false,
            endedAt: null,
            createdAt: periodStart,
            updatedAt: now,
          },
        ],
        { transaction },
      );
      await queryInterface.bulkInsert(
        'Invoices',
        [
          {
            organizationId: org.id,
            stripeInvoiceId: DEMO.invoice,
            number: 'FAKE-00001',
            status: 'paid',
            billingReason: 'subscription_create',
            total: UNIT_AMOUNT * DEMO.seats,
            amountPaid: UNIT_AMOUNT * DEMO.seats,
            currency: 'eur',
            periodStart,
            periodEnd,
            issuedAt: periodStart,
            paidAt: periodStart,
            createdAt: periodStart,
            updatedAt: now,
          },
        ],
        { transaction },
      );
    });
  },

  async down(queryInterface) {
    await queryInterface.bulkDelete('Invoices', { stripeInvoiceId: DEMO.invoice });
    await queryInterface.bulkDelete('Subscriptions', { stripeSubscriptionId: DEMO.subscription });
  },
};

'use strict';

// "project": a rate per day paid for the whole project's duration (site overheads), instead of
// one activity's. Null for lump sums and per-activity-day lines.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('CostItems', 'span', { type: Sequelize.STRING(16), allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('CostItems', 'span');
  },
};

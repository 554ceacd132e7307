'use strict';

// The WBS lines a risk's cost belongs to, by code: contingency is allocated to them.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('RiskEvents', 'itemCodes', { type: Sequelize.JSON, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('RiskEvents', 'itemCodes');
  },
};

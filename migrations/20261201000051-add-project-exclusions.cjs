'use strict';

// What the estimate leaves out (and the funder must cover elsewhere), printed on every brief.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Projects', 'exclusions', { type: Sequelize.TEXT, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Projects', 'exclusions');
  },
};

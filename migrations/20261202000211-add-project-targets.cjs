'use strict';

// The project's cost target and finish target (e.g. the sponsor's budget and handover date),
// offered as the defaults of each new run so that its probabilities speak to them.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Projects', 'costTarget', { type: Sequelize.DOUBLE, allowNull: true });
    await queryInterface.addColumn('Projects', 'finishTarget', { type: Sequelize.DATEONLY, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Projects', 'finishTarget');
    await queryInterface.removeColumn('Projects', 'costTarget');
  },
};

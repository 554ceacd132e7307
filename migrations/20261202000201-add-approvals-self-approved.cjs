'use strict';

// A decision by the person who started the run (allowed only where the organisation says so)
// stays marked as such on the brief and in the trend.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Approvals', 'selfApproved', {
      type: Sequelize.BOOLEAN,
      allowNull: false,
      defaultValue: false,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Approvals', 'selfApproved');
  },
};

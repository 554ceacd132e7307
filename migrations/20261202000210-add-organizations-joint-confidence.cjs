'use strict';

// The joint confidence (chance of meeting both a cost and a finish) at which the outcome draws the
// frontier of cost and finish pairs: the organisation's choice, in whole percent, 70 by default.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Organizations', 'jointConfidence', {
      type: Sequelize.TINYINT.UNSIGNED,
      allowNull: false,
      defaultValue: 70,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Organizations', 'jointConfidence');
  },
};

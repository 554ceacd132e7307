'use strict';

// The activities a risk's delay lengthens, by code (a risk may delay several). Codes, like an
// activity's predecessors, so a rename is carried by the register save. Null on rows written
// before: their single `activityId` link is read in its place.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('RiskEvents', 'activityCodes', { type: Sequelize.JSON, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('RiskEvents', 'activityCodes');
  },
};

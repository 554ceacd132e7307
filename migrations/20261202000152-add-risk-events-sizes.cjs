'use strict';

// Whether one draw sizes both a risk's cost and its delay ("linked") or the delay takes its own
// ("independent").
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('RiskEvents', 'sizes', {
      type: Sequelize.ENUM('linked', 'independent'),
      allowNull: false,
      defaultValue: 'linked',
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('RiskEvents', 'sizes');
  },
};

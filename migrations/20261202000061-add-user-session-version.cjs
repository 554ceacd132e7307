'use strict';

// Every session carries the user's session version from sign-in; raising it (sign-out,
// password reset) ends all sessions issued before.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Users', 'sessionVersion', {
      type: Sequelize.INTEGER.UNSIGNED,
      allowNull: false,
      defaultValue: 0,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Users', 'sessionVersion');
  },
};

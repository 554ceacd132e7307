'use strict';

// The assumptions a project's estimate rests on, printed on every brief.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Projects', 'assumptions', { type: Sequelize.TEXT, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Projects', 'assumptions');
  },
};

'use strict';

// A probabilistic branch: the probability that an activity happens (null: it always does).
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('Activities', 'existence', { type: Sequelize.DOUBLE, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('Activities', 'existence');
  },
};

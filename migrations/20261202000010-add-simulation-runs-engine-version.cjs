'use strict';

// The engine version each run was computed with, so that a stored run is never recomputed by a
// different engine without saying so. Null for runs from before it was recorded.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('SimulationRuns', 'engineVersion', {
      type: Sequelize.STRING(32),
      allowNull: true,
    });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('SimulationRuns', 'engineVersion');
  },
};

'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'RiskDrivers',
      {
        id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
        organizationId: {
          type: Sequelize.INTEGER,
          allowNull: false,
          references: { model: 'Organizations', key: 'id' },
          onDelete: 'CASCADE',
        },
        projectId: {
          type: Sequelize.INTEGER,
          allowNull: false,
          references: { model: 'Projects', key: 'id' },
          onDelete: 'CASCADE',
        },
        code: { type: Sequelize.STRING(40), allowNull: false },
        name: { type: Sequelize.STRING(255), allowNull: false },
        standsFor: { type: Sequelize.TEXT, allowNull: true },
        probability: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 1 },
        // The factor's distribution, as the model file's DistSpec (a multiplier, 1 = no change).
        factor: { type: Sequelize.JSON, allowNull: false },
        // How the estimator states the range: as percentage changes or as factors.
        entry: { type: Sequelize.ENUM('change', 'factor'), allowNull: false, defaultValue: 'change' },
        // Codes and WBS branches as typed ("3.*"), resolved when the model is built.
        applies: { type: Sequelize.JSON, allowNull: false },
        sortOrder: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { driver_project_code: { fields: ['projectId', 'code'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('RiskDrivers');
  },
};

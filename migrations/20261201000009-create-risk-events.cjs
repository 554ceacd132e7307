'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'RiskEvents',
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
        title: { type: Sequelize.STRING(255), allowNull: false },
        cause: { type: Sequelize.TEXT, allowNull: true },
        event: { type: Sequelize.TEXT, allowNull: true },
        effect: { type: Sequelize.TEXT, allowNull: true },
        ownerName: { type: Sequelize.STRING(120), allowNull: true },
        status: {
          type: Sequelize.ENUM('open', 'mitigating', 'closed', 'occurred'),
          allowNull: false,
          defaultValue: 'open',
        },
        response: {
          type: Sequelize.ENUM('avoid', 'reduce', 'transfer', 'accept'),
          allowNull: false,
          defaultValue: 'reduce',
        },
        probability: { type: Sequelize.DOUBLE, allowNull: false },
        // Impacts are distributions of the model file; either may be absent.
        costImpact: { type: Sequelize.JSON, allowNull: true },
        delayImpact: { type: Sequelize.JSON, allowNull: true },
        activityId: {
          type: Sequelize.INTEGER,
          allowNull: true,
          references: { model: 'Activities', key: 'id' },
          onDelete: 'SET NULL',
        },
        postProbability: { type: Sequelize.DOUBLE, allowNull: true },
        postCostImpact: { type: Sequelize.JSON, allowNull: true },
        postDelayImpact: { type: Sequelize.JSON, allowNull: true },
        mitigationCost: { type: Sequelize.DOUBLE, allowNull: true },
        sortOrder: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { risk_project_code: { fields: ['projectId', 'code'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('RiskEvents');
  },
};

'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'CostItems',
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
        // The WBS code, unique within the project: it is the line's id in the model file.
        code: { type: Sequelize.STRING(40), allowNull: false },
        description: { type: Sequelize.STRING(255), allowNull: false },
        base: { type: Sequelize.DOUBLE, allowNull: true },
        // A distribution of the model file ({ "type": "pert", "low": …, "mode": …, "high": … }).
        dist: { type: Sequelize.JSON, allowNull: true },
        // Time-dependent lines: a rate per working day (number or distribution) × the activity's duration.
        ratePerDay: { type: Sequelize.JSON, allowNull: true },
        activityId: {
          type: Sequelize.INTEGER,
          allowNull: true,
          references: { model: 'Activities', key: 'id' },
          onDelete: 'SET NULL',
        },
        ownerName: { type: Sequelize.STRING(120), allowNull: true },
        notes: { type: Sequelize.TEXT, allowNull: true },
        sortOrder: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { cost_item_project_code: { fields: ['projectId', 'code'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('CostItems');
  },
};

'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'Activities',
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
        // The duration as a distribution of the model file, in working days.
        duration: { type: Sequelize.JSON, allowNull: false },
        // [{ "code": "A1", "lag": 0 }]: finish-to-start links with a lag in working days.
        predecessors: { type: Sequelize.JSON, allowNull: false },
        sortOrder: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { activity_project_code: { fields: ['projectId', 'code'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Activities');
  },
};

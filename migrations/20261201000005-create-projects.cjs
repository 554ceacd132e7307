'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'Projects',
      {
        id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
        organizationId: {
          type: Sequelize.INTEGER,
          allowNull: false,
          references: { model: 'Organizations', key: 'id' },
          onDelete: 'CASCADE',
        },
        name: { type: Sequelize.STRING(160), allowNull: false },
        code: { type: Sequelize.STRING(32), allowNull: false },
        currency: { type: Sequelize.STRING(3), allowNull: false, defaultValue: 'EUR' },
        estimateClass: { type: Sequelize.TINYINT, allowNull: false, defaultValue: 4 },
        stage: { type: Sequelize.STRING(40), allowNull: false, defaultValue: 'Concept' },
        baseDate: { type: Sequelize.DATEONLY, allowNull: false },
        description: { type: Sequelize.TEXT, allowNull: true },
        archivedAt: { type: Sequelize.DATE, allowNull: true },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { project_org_code: { fields: ['organizationId', 'code'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Projects');
  },
};

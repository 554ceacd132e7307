'use strict';

module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'Correlations',
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
        // The codes of two inputs of the project (a line item, an activity or a risk event).
        aCode: { type: Sequelize.STRING(40), allowNull: false },
        bCode: { type: Sequelize.STRING(40), allowNull: false },
        rho: { type: Sequelize.DOUBLE, allowNull: false },
        version: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { correlation_pair: { fields: ['projectId', 'aCode', 'bCode'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Correlations');
  },
};

'use strict';

// A member's choice to receive or not one kind of notice. No row means "on".
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'NotificationPreferences',
      {
        id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
        userId: {
          type: Sequelize.INTEGER,
          allowNull: false,
          references: { model: 'Users', key: 'id' },
          onDelete: 'CASCADE',
        },
        kind: { type: Sequelize.STRING(40), allowNull: false },
        enabled: { type: Sequelize.BOOLEAN, allowNull: false },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      {
        uniqueKeys: { notification_preferences_user_kind: { fields: ['userId', 'kind'] } },
      },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('NotificationPreferences');
  },
};

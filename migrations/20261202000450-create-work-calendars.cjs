'use strict';

// The organisation's working calendar: the weekdays it works and its holidays. No row means
// Monday to Friday with no holidays.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('WorkCalendars', {
      id: { type: Sequelize.INTEGER, autoIncrement: true, primaryKey: true },
      organizationId: {
        type: Sequelize.INTEGER,
        allowNull: false,
        unique: true,
        references: { model: 'Organizations', key: 'id' },
        onDelete: 'CASCADE',
      },
      // ISO weekdays as digits, 1 = Monday … 7 = Sunday, e.g. "12345".
      weekdays: { type: Sequelize.STRING(7), allowNull: false },
      // [{ "date": "YYYY-MM-DD", "name": "…" }], sorted by date.
      holidays: { type: Sequelize.TEXT('medium'), allowNull: false },
      // Raised by every change; a change must name the version it was made from.
      version: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('WorkCalendars');
  },
};

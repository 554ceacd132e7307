'use strict';

// A sponsor's decision on a run: approved as the project's baseline, or returned. A row is
// written once and never updated (no updatedAt). The unique key on runId makes a second
// decision on the same run impossible even when two sponsors press at the same moment.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'Approvals',
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
        runId: {
          type: Sequelize.INTEGER,
          allowNull: false,
          references: { model: 'SimulationRuns', key: 'id' },
          onDelete: 'CASCADE',
        },
        sponsorId: {
          type: Sequelize.INTEGER,
          allowNull: true,
          references: { model: 'Users', key: 'id' },
          onDelete: 'SET NULL',
        },
        // Kept beside the id so that the record still says who decided if the user is removed.
        sponsorName: { type: Sequelize.STRING(160), allowNull: false },
        decision: { type: Sequelize.ENUM('approved', 'returned'), allowNull: false },
        comment: { type: Sequelize.TEXT, allowNull: false },
        // The project's stage and estimate class when the decision was taken.
        stage: { type: Sequelize.STRING(40), allowNull: false },
        estimateClass: { type: Sequelize.TINYINT, allowNull: false },
        createdAt: { type: Sequelize.DATE, allowNull: false },
      },
      { uniqueKeys: { approval_run: { fields: ['runId'] } } },
    );
  },
  async down(queryInterface) {
    await queryInterface.dropTable('Approvals');
  },
};

'use strict';

// One simulation run of a project: its settings, its progress while it runs, the exact model file
// it ran on (so that it can be reproduced and downloaded) and, once it succeeds, the engine's result.
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('SimulationRuns', {
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
      startedById: {
        type: Sequelize.INTEGER,
        allowNull: true,
        references: { model: 'Users', key: 'id' },
        onDelete: 'SET NULL',
      },
      status: {
        type: Sequelize.ENUM('queued', 'running', 'succeeded', 'failed', 'cancelled'),
        allowNull: false,
        defaultValue: 'queued',
      },
      settings: { type: Sequelize.JSON, allowNull: false },
      progress: { type: Sequelize.DOUBLE, allowNull: false, defaultValue: 0 },
      iterationsDone: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      failureReason: { type: Sequelize.TEXT, allowNull: true },
      // The model file with the run's settings, as canonical JSON; inputHash is its SHA-256.
      inputSnapshot: { type: Sequelize.TEXT('long'), allowNull: false },
      inputHash: { type: Sequelize.CHAR(64), allowNull: false },
      // The engine's result file, and beside it a capped sample of (cost, duration) pairs.
      result: { type: Sequelize.TEXT('long'), allowNull: true },
      resultSample: { type: Sequelize.TEXT('long'), allowNull: true },
      // P50/P80 of cost and duration, for lists that must not read whole results.
      summary: { type: Sequelize.JSON, allowNull: true },
      startedAt: { type: Sequelize.DATE, allowNull: true },
      finishedAt: { type: Sequelize.DATE, allowNull: true },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('SimulationRuns');
  },
};

'use strict';
// Gives the two demo projects the sponsor's cost and finish targets (the ones their assumptions
// state), so that a new run starts with them. A target someone has already set is left alone.
const { QueryTypes } = require('sequelize');
const { DEMO_DRIVERS } = require('./data/demo-drivers.cjs');
const { ORGANIZATION } = require('./data/demo-accounts.cjs');

const projectOf =
  'SELECT p.id FROM Projects p JOIN Organizations o ON o.id = p.organizationId WHERE p.code = ? AND o.name = ?';

module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      for (const [code, demo] of Object.entries(DEMO_DRIVERS)) {
        const [project] = await queryInterface.sequelize.query(`${projectOf} LIMIT 1 FOR UPDATE`, {
          replacements: [code, ORGANIZATION],
          type: QueryTypes.SELECT,
          transaction,
        });
        if (!project) continue;
        await queryInterface.sequelize.query(
          'UPDATE Projects SET costTarget = COALESCE(costTarget, ?), finishTarget = COALESCE(finishTarget, ?) WHERE id = ?',
          {
            replacements: [demo.targets.cost, demo.targets.finish, project.id],
            type: QueryTypes.UPDATE,
            transaction,
          },
        );
      }
    });
  },

  async down(queryInterface) {
    for (const [code, demo] of Object.entries(DEMO_DRIVERS)) {
      await queryInterface.sequelize.query(
        `UPDATE Projects SET costTarget = NULL, finishTarget = NULL WHERE id IN (SELECT id FROM (${projectOf}) AS demo) AND costTarget = ? AND finishTarget = ?`,
        {
          replacements: [code, ORGANIZATION, demo.targets.cost, demo.targets.finish],
          type: QueryTypes.UPDATE,
        },
      );
    }
  },
};

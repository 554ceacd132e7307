'use strict';
// Gives the two demo projects their risk drivers and the correlations that tie the drivers to
// their risks, once (a project that already has drivers is left as it is), and states the
// sponsor's targets in the project's assumptions when none are written yet.
const { QueryTypes } = require('sequelize');
const { DEMO_DRIVERS } = require('./data/demo-drivers.cjs');
const { ORGANIZATION } = require('./data/demo-accounts.cjs');

const money = (v) =>
  `€${(v / 1e6).toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} m`;
const day = (iso) =>
  new Date(`${iso}T00:00:00Z`).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  });

module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const stamp = { version: 1, createdAt: now, updatedAt: now };
    await queryInterface.sequelize.transaction(async (transaction) => {
      for (const [code, demo] of Object.entries(DEMO_DRIVERS)) {
        const [project] = await queryInterface.sequelize.query(
          'SELECT p.id, p.organizationId, p.assumptions FROM Projects p JOIN Organizations o ON o.id = p.organizationId WHERE p.code = ? AND o.name = ? LIMIT 1 FOR UPDATE',
          { replacements: [code, ORGANIZATION], type: QueryTypes.SELECT, transaction },
        );
        if (!project) continue;
        const [{ n }] = await queryInterface.sequelize.query(
          'SELECT COUNT(*) AS n FROM RiskDrivers WHERE projectId = ?',
          {
            replacements: [project.id],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        if (Number(n) > 0) continue;
        const scope = { organizationId: project.organizationId, projectId: project.id };
        await queryInterface.bulkInsert(
          'RiskDrivers',
          demo.drivers.map((d, i) => ({
            ...scope,
            ...stamp,
            code: d.code,
            name: d.name,
            standsFor: d.standsFor,
            probability: d.probability,
            factor: JSON.stringify(d.factor),
            entry: d.entry,
            applies: JSON.stringify(d.applies),
            sortOrder: i,
          })),
          { transaction },
        );
        const existing = await queryInterface.sequelize.query(
          'SELECT aCode, bCode FROM Correlations WHERE projectId = ?',
          {
            replacements: [project.id],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        const pair = (a, b) => [a, b].sort().join('\u0000');
        const taken = new Set(existing.map((c) => pair(c.aCode, c.bCode)));
        const fresh = demo.correlations.filter((c) => !taken.has(pair(c.aCode, c.bCode)));
        if (fresh.length)
          await queryInterface.bulkInsert(
            'Correlations',
            fresh.map((c) => ({ ...scope, ...stamp, aCode: c.aCode, bCode: c.bCode, rho: c.rho })),
            { transaction },
          );
        if (!project.assumptions) {
          await queryInterface.sequelize.query('UPDATE Projects SET assumptions = ? WHERE id = ?', {
            replacements: [
              `The sponsor's targets: a cost of at most ${money(demo.targets.cost)} and handover by ${day(demo.targets.finish)}.`,
              project.id,
            ],
            type: QueryTypes.UPDATE,
            transaction,
          });
        }
      }
    });
  },

  async down(queryInterface) {
    const codes = Object.keys(DEMO_DRIVERS);
    const driverCodes = [
      ...new Set(Object.values(DEMO_DRIVERS).flatMap((d) => d.drivers.map((x) => x.code))),
    ];
    await queryInterface.sequelize.query(
      'DELETE c FROM Correlations c JOIN Projects p ON p.id = c.projectId WHERE p.code IN (?) AND (c.aCode IN (?) OR c.bCode IN (?))',
      { replacements: [codes, driverCodes, driverCodes], type: QueryTypes.DELETE },
    );
    await queryInterface.sequelize.query(
      'DELETE d FROM RiskDrivers d JOIN Projects p ON p.id = d.projectId WHERE p.code IN (?)',
      { replacements: [codes], type: QueryTypes.DELETE },
    );
  },
};

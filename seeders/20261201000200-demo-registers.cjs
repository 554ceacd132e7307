'use strict';
// Fills the two demo projects' registers (line items, risks, schedule, correlations).
const { QueryTypes } = require('sequelize');
const { DEMO_REGISTERS } = require('./data/demo-registers.cjs');
const { ORGANIZATION } = require('./data/demo-accounts.cjs');

const json = (v) => (v === null || v === undefined ? null : JSON.stringify(v));

module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const stamp = { version: 1, createdAt: now, updatedAt: now };
    await queryInterface.sequelize.transaction(async (transaction) => {
      for (const reg of DEMO_REGISTERS) {
        const [project] = await queryInterface.sequelize.query(
          'SELECT p.id, p.organizationId FROM Projects p JOIN Organizations o ON o.id = p.organizationId WHERE p.code = ? AND o.name = ? LIMIT 1',
          { replacements: [reg.code, ORGANIZATION], type: QueryTypes.SELECT, transaction },
        );
        if (!project) continue;
        const scope = { organizationId: project.organizationId, projectId: project.id };
        const [{ n }] = await queryInterface.sequelize.query(
          'SELECT COUNT(*) AS n FROM CostItems WHERE projectId = ?',
          {
            replacements: [project.id],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        if (Number(n) > 0) continue;
        await queryInterface.bulkInsert(
          'Activities',
          reg.activities.map((a, i) => ({
            ...scope,
            ...stamp,
            code: a.code,
            name: a.name,
            duration: json(a.duration),
            predecessors: json(a.predecessors),
            sortOrder: i,
          })),
          { transaction },
        );
        const acts = await queryInterface.sequelize.query(
          'SELECT id, code FROM Activities WHERE projectId = ?',
          {
            replacements: [project.id],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        const activityId = new Map(acts.map((a) => [a.code, a.id]));
        await queryInterface.bulkInsert(
          'CostItems',
          reg.items.map((r, i) => ({
            ...scope,
            ...stamp,
            code: r.code,
            description: r.description,
            base: r.base,
            dist: json(r.dist),
            ratePerDay: json(r.ratePerDay),
            activityId: r.activity ? activityId.get(r.activity) : null,
            ownerName: r.ownerName,
            notes: r.section,
            sortOrder: i,
          })),
          { transaction },
        );
        await queryInterface.bulkInsert(
          'RiskEvents',
          reg.risks.map((r, i) => ({
            ...scope,
            ...stamp,
            code: r.code,
            title: r.title,
            cause: null,
            event: null,
            effect: null,
            ownerName: r.ownerName,
            status: r.status,
            response: r.response,
            probability: r.probability,
            costImpact: json(r.costImpact),
            delayImpact: json(r.delayImpact),
            activityId: r.activity ? activityId.get(r.activity) : null,
            postProbability: r.postProbability,
            postCostImpact: null,
            postDelayImpact: null,
            mitigationCost: r.mitigationCost,
            sortOrder: i,
          })),
          { transaction },
        );
        await queryInterface.bulkInsert(
          'Correlations',
          reg.correlations.map((c) => ({ ...scope, ...stamp, aCode: c.aCode, bCode: c.bCode, rho: c.rho })),
          { transaction },
        );
      }
    });
  },

  async down(queryInterface) {
    const codes = DEMO_REGISTERS.map((r) => r.code);
    for (const table of ['Correlations', 'RiskEvents', 'CostItems', 'Activities']) {
      await queryInterface.sequelize.query(
        `DELETE t FROM ${table} t JOIN Projects p ON p.id = t.projectId WHERE p.code IN (?)`,
        { replacements: [codes], type: QueryTypes.DELETE },
      );
    }
  },
};

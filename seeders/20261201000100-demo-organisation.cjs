'use strict';
// The demo organisation, an invented regional infrastructure owner, with one member per
// role and two projects. The registers of the projects are filled by later seeders.
const bcrypt = require('bcryptjs');
const { QueryTypes } = require('sequelize');
const { ORGANIZATION, PASSWORD, PEOPLE } = require('./data/demo-accounts.cjs');

module.exports = {
  async up(queryInterface) {
    const now = new Date();
    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.bulkInsert(
        'Organizations',
        [{ name: ORGANIZATION, createdAt: now, updatedAt: now }],
        { transaction },
      );
      // Raw queries need an explicit type with the mariadb 3 driver.
      const [org] = await queryInterface.sequelize.query(
        'SELECT id FROM Organizations WHERE name = ? ORDER BY id LIMIT 1',
        {
          replacements: [ORGANIZATION],
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      const passwordHash = bcrypt.hashSync(PASSWORD, 10);
      await queryInterface.bulkInsert(
        'Users',
        PEOPLE.map((p) => ({ email: p.email, name: p.name, passwordHash, createdAt: now, updatedAt: now })),
        { transaction },
      );
      const users = await queryInterface.sequelize.query('SELECT id, email FROM Users WHERE email IN (?)', {
        replacements: [PEOPLE.map((p) => p.email)],
        type: QueryTypes.SELECT,
        transaction,
      });
      const idByEmail = new Map(users.map((u) => [u.email, u.id]));
      await queryInterface.bulkInsert(
        'Memberships',
        PEOPLE.map((p) => ({
          userId: idByEmail.get(p.email),
          organizationId: org.id,
          role: p.role,
          createdAt: now,
          updatedAt: now,
        })),
        { transaction },
      );
      await queryInterface.bulkInsert(
        'Projects',
        [
          {
            organizationId: org.id,
            code: 'ASH-WTP',
            name: 'Ashby Creek water treatment upgrade',
            currency: 'EUR',
            estimateClass: 3,
            stage: 'Preliminary design',
            baseDate: '2027-03-01',
            description:
              'Doubling filtration capacity at a live works, with a new clear-water tank and an inlet main under the creek.',
            version: 1,
            createdAt: now,
            updatedAt: now,
          },
          {
            organizationId: org.id,
            code: 'NTH-DEP',
            name: 'Northline tram depot and stabling yard',
            currency: 'EUR',
            estimateClass: 4,
            stage: 'Feasibility',
            baseDate: '2027-09-01',
            description:
              'A maintenance depot for 24 trams on a former rail freight site, with contaminated ground and a new grid connection.',
            version: 1,
            createdAt: now,
            updatedAt: now,
          },
        ],
        { transaction },
      );
    });
  },

  async down(queryInterface) {
    await queryInterface.bulkDelete('Organizations', { name: ORGANIZATION });
    await queryInterface.bulkDelete('Users', { email: PEOPLE.map((p) => p.email) });
  },
};

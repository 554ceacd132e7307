'use strict';
// The demo organisation's working calendar: Monday to Friday with an invented list of closure
// days (a year-end shutdown and a few days of the organisation's own), so that finish dates in
// the demo step over holidays as real ones do.
const { QueryTypes } = require('sequelize');
const { ORGANIZATION } = require('./data/demo-accounts.cjs');

const CLOSURES = [
  ['2026-12-24', 'Year-end shutdown'],
  ['2026-12-25', 'Year-end shutdown'],
  ['2026-12-28', 'Year-end shutdown'],
  ['2026-12-29', 'Year-end shutdown'],
  ['2026-12-30', 'Year-end shutdown'],
  ['2026-12-31', 'Year-end shutdown'],
  ['2027-01-01', 'Year-end shutdown'],
  ['2027-04-02', 'Spring holiday'],
  ['2027-04-05', 'Spring holiday'],
  ['2027-05-31', 'Founders day'],
  ['2027-08-30', 'Late summer holiday'],
  ['2027-12-24', 'Year-end shutdown'],
  ['2027-12-27', 'Year-end shutdown'],
  ['2027-12-28', 'Year-end shutdown'],
  ['2027-12-29', 'Year-end shutdown'],
  ['2027-12-30', 'Year-end shutdown'],
  ['2027-12-31', 'Year-end shutdown'],
  ['2028-04-14', 'Spring holiday'],
  ['2028-04-17', 'Spring holiday'],
  ['2028-05-29', 'Founders day'],
  ['2028-08-28', 'Late summer holiday'],
  ['2028-12-25', 'Year-end shutdown'],
  ['2028-12-26', 'Year-end shutdown'],
  ['2028-12-27', 'Year-end shutdown'],
  ['2028-12-28', 'Year-end shutdown'],
  ['2028-12-29', 'Year-end shutdown'],
].map(([date, name]) => ({ date, name }));

module.exports = {
  async up(queryInterface) {
    const [org] = await queryInterface.sequelize.query(
      'SELECT id FROM Organizations WHERE name = ? ORDER BY id LIMIT 1',
      {
        replacements: [ORGANIZATION],
        type: QueryTypes.SELECT,
      },
    );
    if (!org) return; // a database whose demo organisation was removed keeps no demo calendar
    const now = new Date();
    await queryInterface.bulkInsert('WorkCalendars', [
      {
        organizationId: org.id,
        weekdays: '12345',
        holidays: JSON.stringify(CLOSURES),
        version: 1,
        createdAt: now,
        updatedAt: now,
      },
    ]);
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete('WorkCalendars', null, {});
  },
};

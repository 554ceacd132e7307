'use strict';
// Invented risk drivers for the two demo projects, the risks they move with, and the targets a
// sponsor would hold them to. The driver ranges carry the uncertainty that the line-item ranges
// leave out (a whole market, the ground, how far the design has got, site productivity), so that
// each project's simulated P10–P90 sits in its estimate class's expected accuracy range.
// Factor ranges: min–max unless `range` says P10–P90; `entry` is how an estimator would type them.

const tri = (low, mode, high, range) => ({
  type: 'triangular',
  low,
  mode,
  high,
  ...(range ? { range: 'p10-p90' } : {}),
});

const WTP = {
  drivers: [
    {
      code: 'D1',
      name: 'Ground conditions',
      standsFor:
        'Made ground and groundwater under the creek crossing and the tank site: the investigation covered one borehole per 40 m of route and none under the creek bed.',
      probability: 1,
      factor: tri(0.92, 1.0, 1.25, true),
      entry: 'change',
      applies: ['2.*', '4.1', '3.1', 'A05', 'A06', 'A08', 'A12'],
    },
    {
      code: 'D2',
      name: 'Market conditions',
      standsFor:
        'Tender prices for civils and M&E packages against the estimate’s price base: three regional water frameworks are tendering in the same year.',
      probability: 1,
      factor: tri(0.9, 1.0, 1.15, true),
      entry: 'change',
      applies: ['2.*', '3.*', '4.*', '5.*', '6.*'],
    },
    {
      code: 'D3',
      name: 'Design maturity',
      standsFor:
        'Preliminary design only: process sizing is fixed, but structural and M&E quantities will grow as the detailed design closes out.',
      probability: 1,
      factor: tri(0.95, 1.0, 1.15, true),
      entry: 'change',
      applies: ['3.*', '5.*', '6.*', 'A01'],
    },
    {
      code: 'D4',
      name: 'Site productivity',
      standsFor:
        'Working inside a live treatment works: permits to work, restricted access and shared cranes slow the follow-on trades.',
      probability: 0.7,
      factor: tri(0.97, 1.05, 1.25),
      entry: 'change',
      applies: ['5.6', '6.5', 'A09', 'A10', 'A11', 'A13', 'A17', 'A20'],
    },
  ],
  correlations: [
    { aCode: 'D1', bCode: 'R08', rho: 0.5 },
    { aCode: 'D1', bCode: 'R01', rho: 0.4 },
    { aCode: 'D2', bCode: 'R19', rho: 0.5 },
    { aCode: 'D2', bCode: 'R06', rho: 0.4 },
    { aCode: 'D3', bCode: 'R14', rho: 0.5 },
    { aCode: 'D2', bCode: 'D3', rho: 0.3 },
    { aCode: 'D4', bCode: 'R18', rho: 0.4 },
  ],
  targets: { cost: 60_000_000, finish: '2030-03-29' },
};

const DEPOT = {
  drivers: [
    {
      code: 'D1',
      name: 'Ground conditions',
      standsFor:
        'A former rail freight yard: ash fill, old foundations and hydrocarbons of unknown extent across the whole platform.',
      probability: 1,
      factor: tri(0.9, 1.0, 1.35, true),
      entry: 'change',
      applies: ['1.*', '4.1', '4.2', 'B08', 'B10', 'B11'],
    },
    {
      code: 'D2',
      name: 'Market conditions',
      standsFor:
        'Rail systems and building prices against the estimate’s price base, with two other tram extensions going to market.',
      probability: 1,
      factor: tri(0.88, 1.0, 1.3, true),
      entry: 'change',
      applies: ['2.*', '3.*', '4.*', '5.*', '6.*', '7.*'],
    },
    {
      code: 'D3',
      name: 'Design maturity',
      standsFor:
        'Feasibility stage: the yard layout and the maintenance building are concept sketches; systems are allowances.',
      probability: 1,
      factor: tri(0.92, 1.02, 1.3, true),
      entry: 'change',
      applies: ['2.*', '3.*', '4.*', '6.*', 'B05'],
    },
    {
      code: 'D4',
      name: 'Possession and site productivity',
      standsFor:
        'Works next to the live main line: possessions are short and overhead line teams are scarce.',
      probability: 0.8,
      factor: tri(0.95, 1.05, 1.3),
      entry: 'change',
      applies: ['2.1', '3.1', 'B13', 'B15', 'B19', 'B22', 'B24'],
    },
  ],
  correlations: [
    { aCode: 'D1', bCode: 'R01', rho: 0.6 },
    { aCode: 'D1', bCode: 'R13', rho: 0.4 },
    { aCode: 'D2', bCode: 'R09', rho: 0.5 },
    { aCode: 'D2', bCode: 'R20', rho: 0.3 },
    { aCode: 'D3', bCode: 'R11', rho: 0.4 },
    { aCode: 'D2', bCode: 'D3', rho: 0.3 },
    { aCode: 'D4', bCode: 'R16', rho: 0.5 },
  ],
  targets: { cost: 125_000_000, finish: '2032-07-30' },
};

module.exports = { DEMO_DRIVERS: { 'ASH-WTP': WTP, 'NTH-DEP': DEPOT } };

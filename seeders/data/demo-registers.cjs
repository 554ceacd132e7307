'use strict';
// Invented registers for the two demo projects: a water treatment upgrade (about €50 m) and a
// tram depot (about €100 m). Ranges vary by a small seeded generator so the data looks worked,
// and is the same on every machine.

function generator(seed) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

const round = (x, step) => Math.round(x / step) * step;

// [section, [description, base amount (€ thousand), kind]] — kind: t triangular, p PERT,
// u uniform, n normal, l lognormal, f fixed, d per day (rate € per day, activity).
const WTP = {
  code: 'ASH-WTP',
  scale: 0.76,
  sections: [
    [
      'Preliminaries and site',
      [
        ['Site establishment and welfare', 620, 'p'],
        ['Temporary works design', 240, 't'],
        ['Site staff (contractor)', 6.8, 'd', 'A14'],
        ['Site facilities and security', 2.1, 'd', 'A14'],
        ['Traffic management on Creek Road', 180, 'u'],
        ['Surveys and investigations', 310, 'l'],
        ['Environmental monitoring', 0.9, 'd', 'A16'],
      ],
    ],
    [
      'Inlet works and creek crossing',
      [
        ['Inlet screen chamber', 1850, 'p'],
        ['Directional drill under the creek', 3400, 'l'],
        ['Inlet main DN900, 1.2 km', 2950, 't'],
        ['Thrust and reception pits', 780, 'p'],
        ['Dewatering during pit works', 3.2, 'd', 'A06'],
        ['Creek bank reinstatement', 260, 't'],
        ['Flow meter and valve chamber', 540, 'p'],
      ],
    ],
    [
      'Filtration building',
      [
        ['Piling, 180 bored piles', 2100, 'p'],
        ['Substructure and basement', 3300, 'p'],
        ['Superstructure frame', 2650, 't'],
        ['Cladding and roofing', 1480, 't'],
        ['Filter cells, 8 rapid gravity', 5200, 'p'],
        ['Filter media supply and placing', 940, 'n'],
        ['Building services', 860, 't'],
        ['Pipe gallery', 1320, 'p'],
      ],
    ],
    [
      'Clear-water tank',
      [
        ['Excavation and disposal', 1650, 'l'],
        ['Base slab and walls', 3900, 'p'],
        ['Roof slab and waterproofing', 1250, 't'],
        ['Tank testing and disinfection', 210, 'u'],
        ['Outlet pipework', 690, 't'],
        ['Landscaping over the tank', 180, 'f'],
      ],
    ],
    [
      'Process mechanical',
      [
        ['Backwash pumps and blowers', 1280, 'p'],
        ['Chemical dosing plant', 1560, 'p'],
        ['Sludge thickening', 1940, 't'],
        ['Process pipework and valves', 2300, 'p'],
        ['Lifting equipment', 320, 'f'],
        ['Mechanical installation labour', 1750, 'n'],
        ['Spares and tools', 150, 'u'],
      ],
    ],
    [
      'Electrical, control and automation',
      [
        ['HV substation upgrade', 1420, 'l'],
        ['LV distribution and MCCs', 1680, 'p'],
        ['Control system and SCADA', 1350, 't'],
        ['Instrumentation', 880, 'p'],
        ['Cabling and containment', 1120, 'n'],
        ['Standby generator', 610, 't'],
      ],
    ],
    [
      'Commissioning and handover',
      [
        ['Commissioning team', 4.6, 'd', 'A27'],
        ['Process proving period', 420, 't'],
        ['Operator training', 140, 'u'],
        ['Temporary treatment during switchover', 780, 'l'],
        ['As-built records', 120, 'f'],
      ],
    ],
    [
      'Client costs',
      [
        ['Design consultancy', 2450, 'n'],
        ['Client project team', 5.9, 'd', 'A14'],
        ['Land and consents', 380, 'l'],
        ['Utility diversions', 920, 'l'],
        ['Independent checker', 210, 't'],
        ['Insurance', 460, 'u'],
        ['Legal and procurement', 290, 't'],
        ['Stakeholder communications', 130, 'u'],
        ['Archaeology watching brief', 95, 't'],
        ['Client-supplied membranes trial', 340, 'p'],
      ],
    ],
  ],
  activities: [
    ['A01', 'Detailed design', [80, 100, 140], []],
    ['A02', 'Permits and consents', [60, 90, 150], []],
    ['A03', 'Contract award', [20, 30, 45], ['A01']],
    ['A04', 'Mobilisation', [15, 20, 30], ['A03']],
    ['A05', 'Inlet pits', [35, 45, 70], ['A04', 'A02']],
    ['A06', 'Creek drill and main', [60, 75, 120], ['A05']],
    ['A07', 'Inlet chamber', [40, 50, 70], ['A05']],
    ['A08', 'Filtration piling', [30, 40, 60], ['A04']],
    ['A09', 'Filtration substructure', [50, 65, 90], ['A08']],
    ['A10', 'Filtration frame and envelope', [60, 75, 100], ['A09']],
    ['A11', 'Filter cells', [70, 85, 120], ['A09+10']],
    ['A12', 'Tank excavation', [25, 35, 60], ['A04']],
    ['A13', 'Tank structure', [70, 90, 130], ['A12']],
    ['A14', 'Main works period', [300, 340, 420], ['A04']],
    ['A15', 'Tank roof and testing', [30, 40, 60], ['A13']],
    ['A16', 'Environmental window works', [40, 50, 70], ['A06']],
    ['A17', 'Process mechanical install', [60, 80, 110], ['A10', 'A11']],
    ['A18', 'Pipework gallery', [40, 55, 80], ['A10']],
    ['A19', 'HV substation', [50, 70, 120], ['A04']],
    ['A20', 'Electrical install', [60, 75, 100], ['A17', 'A19']],
    ['A21', 'Control system', [40, 50, 75], ['A20']],
    ['A22', 'Outlet connections', [20, 25, 40], ['A15', 'A18']],
    ['A23', 'Dry commissioning', [25, 30, 45], ['A21', 'A22']],
    ['A24', 'Wet commissioning', [30, 40, 60], ['A23', 'A06', 'A07']],
    ['A25', 'Switchover', [10, 14, 25], ['A24']],
    ['A26', 'Landscaping', [20, 25, 35], ['A15']],
    ['A27', 'Process proving', [40, 50, 70], ['A25']],
    ['A28', 'Training', [10, 15, 20], ['A24-5']],
    ['A29', 'Handover', [10, 12, 20], ['A27', 'A28', 'A26']],
    ['A30', 'Defects period start', [5, 5, 10], ['A29']],
  ],
  risks: [
    ['R01', 'Drill hits buried boulders under the creek', 0.3, [350, 700, 1800], [10, 25, 60], 'A06'],
    ['R02', 'Contaminated spoil in tank excavation', 0.35, [250, 600, 1400], [5, 15, 30], 'A12'],
    ['R03', 'Consent conditions add a fish-passage season restriction', 0.25, null, [20, 40, 90], 'A16'],
    ['R04', 'Live works outage longer than planned at switchover', 0.2, [150, 400, 900], [3, 7, 15], 'A25'],
    ['R05', 'HV connection date slips at the grid operator', 0.4, [60, 120, 300], [15, 30, 70], 'A19'],
    ['R06', 'Filter media price rise', 0.3, [80, 160, 320], null, null],
    ['R07', 'Piling obstruction from old foundations', 0.25, [120, 260, 600], [5, 10, 25], 'A08'],
    ['R08', 'Groundwater higher than surveyed', 0.3, [200, 450, 1000], [7, 15, 35], 'A12'],
    ['R09', 'Control system integration problems', 0.35, [90, 200, 450], [5, 12, 30], 'A21'],
    ['R10', 'Tank fails first water-tightness test', 0.15, [60, 150, 350], [10, 20, 40], 'A15'],
    ['R11', 'Archaeological find on the tank site', 0.1, [50, 150, 500], [10, 30, 80], 'A12'],
    ['R12', 'Key mechanical supplier insolvency', 0.08, [300, 700, 1500], [20, 45, 90], 'A17'],
    ['R13', 'Flooding of the creek during drilling', 0.15, [100, 250, 700], [5, 15, 40], 'A06'],
    ['R14', 'Design changes from the operator review', 0.45, [150, 350, 800], [5, 10, 25], 'A01'],
    ['R15', 'Utility diversion not where recorded', 0.3, [80, 180, 450], [5, 10, 20], 'A05'],
    ['R16', 'Access road damage claims', 0.2, [40, 90, 220], null, null],
    ['R17', 'Commissioning water quality not met first time', 0.3, [60, 140, 300], [10, 20, 45], 'A24'],
    ['R18', 'Labour shortage for electrical trades', 0.3, [100, 220, 500], [5, 15, 35], 'A20'],
    ['R19', 'Steel price escalation', 0.35, [150, 300, 700], null, null],
    ['R20', 'Neighbour objection to night works', 0.2, [20, 60, 150], [5, 10, 25], 'A06'],
  ],
  correlations: [
    ['3.1', '3.2', 0.6],
    ['3.2', '4.2', 0.5],
    ['4.1', '4.2', 0.4],
    ['5.4', '5.6', 0.7],
    ['6.2', '6.5', 0.6],
    ['2.2', '2.3', 0.5],
    ['A06', 'A16', 0.4],
    ['A09', 'A10', 0.5],
    ['R05', 'R18', 0.3],
    ['3.5', '5.1', 0.3],
  ],
};

const DEPOT = {
  code: 'NTH-DEP',
  scale: 0.8,
  sections: [
    [
      'Enabling works',
      [
        ['Demolition of freight sheds', 1450, 'p'],
        ['Remediation of contaminated ground', 6200, 'l'],
        ['Earthworks and platform', 3900, 't'],
        ['Drainage and attenuation', 2350, 'p'],
        ['Site staff (contractor)', 9.5, 'd', 'B14'],
        ['Temporary access from the ring road', 640, 't'],
        ['Ecology mitigation', 380, 'u'],
        ['Ground investigation', 520, 'l'],
      ],
    ],
    [
      'Track and stabling',
      [
        ['Stabling tracks, 12 roads', 8600, 'p'],
        ['Switches and crossings', 4200, 't'],
        ['Depot approach and connection', 3100, 'l'],
        ['Track drainage', 1150, 'p'],
        ['Buffer stops and wheel stops', 290, 'f'],
        ['Possessions on the main line', 14.5, 'd', 'B09'],
        ['Track testing and commissioning', 450, 't'],
      ],
    ],
    [
      'Overhead line and power',
      [
        ['Overhead line in the yard', 3800, 'p'],
        ['Traction substation', 5200, 'l'],
        ['Grid connection', 4300, 'l'],
        ['Depot LV distribution', 1900, 't'],
        ['Earthing and bonding', 620, 'p'],
        ['Power supply commissioning', 380, 'u'],
      ],
    ],
    [
      'Maintenance building',
      [
        ['Piling', 2600, 'p'],
        ['Pit roads and inspection pits', 3700, 'p'],
        ['Steel frame', 5400, 't'],
        ['Envelope and roofing', 4100, 't'],
        ['Offices and staff accommodation', 3300, 'p'],
        ['Building services', 3900, 'n'],
        ['Workshop fit-out', 1700, 't'],
        ['Roof solar array', 880, 'u'],
      ],
    ],
    [
      'Depot plant',
      [
        ['Wheel lathe, underfloor', 3100, 't'],
        ['Bogie drop and lifting jacks', 2400, 'p'],
        ['Train wash plant', 1650, 'p'],
        ['Sand filling system', 520, 't'],
        ['Overhead cranes', 980, 'f'],
        ['Plant installation', 1250, 'n'],
      ],
    ],
    [
      'Systems',
      [
        ['Depot signalling and point control', 4100, 'l'],
        ['Control room and CCTV', 1400, 't'],
        ['Communications network', 1250, 'p'],
        ['Access control and security fence', 940, 't'],
        ['Systems integration testing', 11.2, 'd', 'B24'],
        ['Asset management system', 560, 'u'],
      ],
    ],
    [
      'External works',
      [
        ['Roads and car park', 1850, 'p'],
        ['Landscaping and noise barrier', 1420, 't'],
        ['Lighting', 760, 'p'],
        ['Ring road junction works', 2100, 'l'],
      ],
    ],
    [
      'Client costs',
      [
        ['Design and engineering', 6800, 'n'],
        ['Client team', 12.4, 'd', 'B14'],
        ['Land purchase and compensation', 3900, 'l'],
        ['Planning and consents', 480, 't'],
        ['Insurance', 920, 'u'],
        ['Independent safety assessor', 560, 't'],
        ['Operator mobilisation and training', 1250, 'p'],
        ['Legal and procurement', 640, 't'],
        ['Community liaison', 210, 'u'],
        ['Heritage recording of freight sheds', 150, 't'],
      ],
    ],
  ],
  activities: [
    ['B01', 'Outline design', [90, 120, 170], []],
    ['B02', 'Planning consent', [120, 160, 260], []],
    ['B03', 'Procurement', [60, 80, 120], ['B01']],
    ['B04', 'Land acquisition', [90, 130, 220], []],
    ['B05', 'Detailed design', [120, 150, 210], ['B03']],
    ['B06', 'Mobilisation', [20, 30, 45], ['B03', 'B04']],
    ['B07', 'Demolition', [30, 45, 70], ['B06', 'B02']],
    ['B08', 'Remediation', [60, 90, 170], ['B07']],
    ['B09', 'Main line connection works', [40, 55, 90], ['B06']],
    ['B10', 'Earthworks and drainage', [60, 80, 120], ['B08']],
    ['B11', 'Building piling', [30, 40, 60], ['B10']],
    ['B12', 'Pits and slab', [60, 80, 110], ['B11']],
    ['B13', 'Steel frame and envelope', [80, 100, 140], ['B12']],
    ['B14', 'Main works period', [480, 540, 680], ['B06']],
    ['B15', 'Stabling track', [90, 120, 170], ['B10']],
    ['B16', 'Switches and crossings', [40, 55, 80], ['B15', 'B09']],
    ['B17', 'Grid connection', [180, 240, 400], ['B04']],
    ['B18', 'Traction substation', [90, 120, 170], ['B10', 'B17-30']],
    ['B19', 'Overhead line', [70, 90, 130], ['B16', 'B18']],
    ['B20', 'Building fit-out', [90, 120, 160], ['B13']],
    ['B21', 'Depot plant install', [60, 80, 120], ['B20']],
    ['B22', 'Signalling install', [80, 100, 150], ['B16']],
    ['B23', 'External works', [60, 80, 110], ['B13+20']],
    ['B24', 'Systems integration', [50, 70, 110], ['B22', 'B21', 'B19']],
    ['B25', 'Energisation', [10, 15, 30], ['B24']],
    ['B26', 'Trial operations', [40, 60, 90], ['B25']],
    ['B27', 'Operator training', [30, 40, 60], ['B25']],
    ['B28', 'Safety case acceptance', [30, 45, 80], ['B26']],
    ['B29', 'Handover', [10, 15, 25], ['B28', 'B27', 'B23']],
    ['B30', 'First trams stabled', [5, 7, 10], ['B29']],
  ],
  risks: [
    ['R01', 'More contaminated ground than the survey shows', 0.45, [900, 2200, 5500], [15, 35, 80], 'B08'],
    ['R02', 'Grid connection offer delayed', 0.4, [150, 400, 900], [30, 60, 140], 'B17'],
    ['R03', 'Planning consent called in', 0.15, [200, 500, 1200], [60, 120, 240], 'B02'],
    ['R04', 'Main line possessions cancelled', 0.3, [150, 350, 800], [10, 25, 60], 'B09'],
    ['R05', 'Unexploded ordnance on the freight site', 0.1, [100, 300, 900], [10, 30, 70], 'B07'],
    ['R06', 'Signalling supplier late with design', 0.35, [200, 450, 1000], [15, 35, 80], 'B22'],
    ['R07', 'Wheel lathe delivery slips', 0.3, [60, 150, 350], [10, 25, 50], 'B21'],
    ['R08', 'Land acquisition by compulsory purchase needed', 0.2, [400, 900, 2200], [40, 90, 180], 'B04'],
    ['R09', 'Steel price escalation', 0.4, [300, 700, 1600], null, null],
    ['R10', 'Bats found in freight sheds', 0.25, [40, 100, 250], [20, 45, 90], 'B07'],
    ['R11', 'Overhead line design changes after safety review', 0.3, [150, 350, 800], [10, 20, 45], 'B19'],
    ['R12', 'Tram fleet arrives before depot is ready', 0.2, [400, 900, 2000], null, null],
    ['R13', 'Piling obstructions from old rail foundations', 0.3, [200, 450, 1100], [10, 20, 45], 'B11'],
    ['R14', 'Integration testing finds interface faults', 0.4, [150, 380, 900], [15, 30, 70], 'B24'],
    ['R15', 'Flooding from the culverted brook', 0.15, [200, 500, 1300], [10, 25, 60], 'B10'],
    ['R16', 'Labour shortage for overhead line teams', 0.3, [150, 300, 700], [10, 20, 50], 'B19'],
    ['R17', 'Noise complaints restrict night working', 0.35, [60, 150, 350], [10, 20, 40], 'B15'],
    ['R18', 'Safety case needs more evidence', 0.3, [80, 200, 450], [15, 30, 70], 'B28'],
    ['R19', 'Heritage listing of the signal box', 0.1, [100, 250, 600], [20, 40, 90], 'B07'],
    ['R20', 'Currency movement on imported plant', 0.35, [100, 250, 600], null, null],
  ],
  correlations: [
    ['1.2', '1.3', 0.5],
    ['2.1', '2.2', 0.6],
    ['3.2', '3.3', 0.4],
    ['4.3', '4.4', 0.7],
    ['4.1', '4.2', 0.5],
    ['6.1', '6.5', 0.4],
    ['B08', 'B10', 0.5],
    ['B15', 'B16', 0.4],
    ['R09', 'R20', 0.3],
    ['3.1', '2.1', 0.3],
  ],
};

function lineRows(project, rand) {
  const rows = [];
  project.sections.forEach(([section, lines], s) => {
    lines.forEach(([description, amount, kind, activity], l) => {
      const code = `${s + 1}.${l + 1}`;
      const base =
        kind === 'd'
          ? round(amount * 1000 * project.scale, 10)
          : round(amount * 1000 * project.scale * (0.95 + 0.1 * rand()), 1000);
      const lo = 0.8 + 0.12 * rand();
      const hi = 1.15 + 0.35 * rand();
      let dist;
      if (kind === 'p')
        dist = { type: 'pert', low: round(base * lo, 1000), mode: base, high: round(base * hi, 1000) };
      else if (kind === 't')
        dist = {
          type: 'triangular',
          low: round(base * lo, 1000),
          mode: base,
          high: round(base * hi, 1000),
          ...(rand() < 0.3 ? { range: 'p10-p90' } : {}),
        };
      else if (kind === 'u')
        dist = { type: 'uniform', low: round(base * lo, 1000), high: round(base * hi, 1000) };
      else if (kind === 'n')
        dist = { type: 'normal', mean: round(base * 1.03, 1000), sd: round(base * 0.08, 1000) };
      else if (kind === 'l')
        dist = { type: 'lognormal', p10: round(base * lo, 1000), p90: round(base * (hi + 0.2), 1000) };
      else if (kind === 'f') dist = { type: 'fixed', value: base };
      else
        dist = { type: 'triangular', low: round(base * 0.9, 100), mode: base, high: round(base * 1.25, 100) };
      rows.push({
        code,
        description,
        section,
        base: kind === 'd' ? null : base,
        dist: kind === 'd' ? null : dist,
        ratePerDay: kind === 'd' ? dist : null,
        activity: kind === 'd' ? activity : null,
        ownerName: ['M. Osei', 'L. Brandt', 'K. Novak', 'S. Varga'][s % 4],
      });
    });
  });
  return rows;
}

function registers(project, seed) {
  const rand = generator(seed);
  const pred = (t) => {
    const m = /^(.+?)([+-]\d+)?$/.exec(t);
    return { code: m[1], lag: m[2] ? Number(m[2]) : 0 };
  };
  return {
    items: lineRows(project, rand),
    activities: project.activities.map(([code, name, [low, mode, high], preds], i) => ({
      code,
      name,
      duration: i % 3 === 1 ? { type: 'triangular', low, mode, high } : { type: 'pert', low, mode, high },
      predecessors: preds.map(pred),
    })),
    risks: project.risks.map(([code, title, probability, cost, delay, activity], i) => ({
      code,
      title,
      probability,
      costImpact: cost
        ? { type: 'pert', low: cost[0] * 1000, mode: cost[1] * 1000, high: cost[2] * 1000 }
        : null,
      delayImpact: delay ? { type: 'triangular', low: delay[0], mode: delay[1], high: delay[2] } : null,
      activity: delay ? activity : null,
      status: i % 7 === 3 ? 'mitigating' : 'open',
      response: ['reduce', 'accept', 'transfer', 'reduce', 'avoid'][i % 5],
      postProbability: i % 4 === 0 ? Math.round(probability * 50) / 100 : null,
      mitigationCost: i % 4 === 0 && cost ? Math.round(cost[0] * 0.3) * 1000 : null,
      ownerName: ['M. Osei', 'L. Brandt', 'K. Novak'][i % 3],
    })),
    correlations: project.correlations.map(([a, b, rho]) => ({ aCode: a, bCode: b, rho })),
  };
}

module.exports = {
  DEMO_REGISTERS: [
    { code: WTP.code, ...registers(WTP, 20270301) },
    { code: DEPOT.code, ...registers(DEPOT, 20270901) },
  ],
};

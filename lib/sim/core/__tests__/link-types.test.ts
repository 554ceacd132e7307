// Link types FS, SS, FF and SF with lags and leads: early and late dates against forward and
// backward passes computed by hand with the precedence diagramming method's rules (common
// practice; the rules as taught for the method, e.g. Fondahl 1961, cited from memory):
//   FS: ES_b ≥ EF_a + lag   SS: ES_b ≥ ES_a + lag   FF: EF_b ≥ EF_a + lag   SF: EF_b ≥ ES_a + lag,
//   no activity starts before time 0, the project lasts until the latest finish, and the backward
//   pass turns the same rules round from that finish; total float = LF − EF.
// Each case's dates were worked out on paper from those rules; the arithmetic is in its comment.
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import type { Model, ModelActivity } from '../formats';
import { scheduleDates } from '../schedule/dates';
import { validateModel } from '../validate';
import { fixed, uniform } from './helpers';

/** One deterministic pass: the dates by activity id, T, and which activities are critical. */
function passOf(activities: ModelActivity[], durations: number[]) {
  const { duration, activities: dates } = scheduleDates(activities, durations);
  const short = Object.fromEntries(
    Object.entries(dates).map(([id, d]) => [
      id,
      { es: d.earlyStart, ef: d.earlyFinish, lf: d.lateFinish, float: d.totalFloat },
    ]),
  );
  const crit = activities.filter((a) => dates[a.id].critical).map((a) => a.id);
  return { T: duration, dates: short, crit };
}

const act = (id: string, predecessors: ModelActivity['predecessors'] = []): ModelActivity => ({
  id,
  duration: fixed(1),
  predecessors,
});

describe('forward and backward passes by link type (hand-computed, precedence diagramming method)', () => {
  it('FS with a lag: B starts 3 days after A finishes', () => {
    // A 10 d; B 4 d, FS+3 from A. ES_B = EF_A + 3 = 13, EF_B = 17 = T; both on the critical path.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'FS', lag: 3 }])], [10, 4]);
    expect(r.dates.B).toMatchObject({ es: 13, ef: 17 });
    expect(r.T).toBe(17);
    expect(r.crit).toEqual(['A', 'B']);
  });

  it('FS with a lead: B starts 4 days before A finishes', () => {
    // A 10 d; B 2 d, FS−4. ES_B = 10 − 4 = 6, EF_B = 8; T = 10 (A's finish, the latest);
    // LF_B = T = 10, so B has 2 days of float.
    const r = passOf([act('A'), act('B', [{ id: 'A', lag: -4 }])], [10, 2]);
    expect(r.dates.B).toMatchObject({ es: 6, ef: 8, lf: 10, float: 2 });
    expect(r.T).toBe(10);
    expect(r.crit).toEqual(['A']);
  });

  it('SS with a lag: B starts 2 days after A starts', () => {
    // A 10 d; B 12 d, SS+2. ES_B = ES_A + 2 = 2, EF_B = 14 = T. Backward: LS_B = 2, so
    // LS_A ≤ LS_B − 2 = 0, LF_A = 10 = EF_A: A is critical (its start drives B).
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'SS', lag: 2 }])], [10, 12]);
    expect(r.dates.B).toMatchObject({ es: 2, ef: 14 });
    expect(r.dates.A).toMatchObject({ lf: 10, float: 0 });
    expect(r.T).toBe(14);
    expect(r.crit).toEqual(['A', 'B']);
  });

  it('SS with a lag and a short successor: the successor has float', () => {
    // A 10 d; B 4 d, SS+2. ES_B = 2, EF_B = 6; T = 10; LF_B = 10, float 4.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'SS', lag: 2 }])], [10, 4]);
    expect(r.dates.B).toMatchObject({ es: 2, ef: 6, lf: 10, float: 4 });
    expect(r.crit).toEqual(['A']);
  });

  it('SS with a lead: B starts 3 days before A starts', () => {
    // P 5 d; A 10 d FS from P (ES_A = 5); B 4 d, SS−3 from A. ES_B = 5 − 3 = 2, EF_B = 6;
    // T = EF_A = 15; LF_B = 15, float 9.
    const r = passOf([act('P'), act('A', ['P']), act('B', [{ id: 'A', type: 'SS', lag: -3 }])], [5, 10, 4]);
    expect(r.dates.B).toMatchObject({ es: 2, ef: 6, float: 9 });
    expect(r.T).toBe(15);
    expect(r.crit).toEqual(['P', 'A']);
  });

  it('FF with a lag: B finishes 2 days after A finishes', () => {
    // A 10 d; B 4 d, FF+2. EF_B ≥ 12, so ES_B = 8, EF_B = 12 = T. Backward: LF_A ≤ LF_B − 2 = 10.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'FF', lag: 2 }])], [10, 4]);
    expect(r.dates.B).toMatchObject({ es: 8, ef: 12 });
    expect(r.dates.A).toMatchObject({ lf: 10, float: 0 });
    expect(r.T).toBe(12);
    expect(r.crit).toEqual(['A', 'B']);
  });

  it('FF with a lead: B finishes 3 days before A finishes', () => {
    // A 10 d; B 4 d, FF−3. EF_B ≥ 7, ES_B = 3, EF_B = 7; T = 10; float of B = 10 − 7 = 3.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'FF', lag: -3 }])], [10, 4]);
    expect(r.dates.B).toMatchObject({ es: 3, ef: 7, float: 3 });
    expect(r.crit).toEqual(['A']);
  });

  it('FF from a short predecessor to a long successor: the successor starts at 0, not before', () => {
    // A 10 d; B 20 d, FF+0. EF_B ≥ 10 gives ES_B ≥ −10, but nothing starts before 0: ES_B = 0,
    // EF_B = 20 = T. LF_A ≤ LF_B = 20, so A has 10 days of float.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'FF' }])], [10, 20]);
    expect(r.dates.B).toMatchObject({ es: 0, ef: 20 });
    expect(r.dates.A).toMatchObject({ lf: 20, float: 10 });
    expect(r.crit).toEqual(['B']);
  });

  it('SF with a lag: B finishes at least 15 days after A starts', () => {
    // P 6 d; A 10 d FS from P (ES_A = 6, EF_A = 16); B 4 d, SF+15 from A.
    // EF_B ≥ ES_A + 15 = 21, ES_B = 17, EF_B = 21 = T. Backward: LS_A ≤ LF_B − 15 = 6, so
    // LF_A = 16 = EF_A (critical), and LF_P ≤ LS_A = 6 (critical).
    const r = passOf([act('P'), act('A', ['P']), act('B', [{ id: 'A', type: 'SF', lag: 15 }])], [6, 10, 4]);
    expect(r.dates.B).toMatchObject({ es: 17, ef: 21 });
    expect(r.dates.A).toMatchObject({ lf: 16, float: 0 });
    expect(r.T).toBe(21);
    expect(r.crit).toEqual(['P', 'A', 'B']);
  });

  it('SF with a short lag: the successor has float', () => {
    // P 6 d; A 10 d after P; B 4 d, SF+5. EF_B ≥ 6 + 5 = 11, ES_B = 7; T = 16; float of B = 5.
    const r = passOf([act('P'), act('A', ['P']), act('B', [{ id: 'A', type: 'SF', lag: 5 }])], [6, 10, 4]);
    expect(r.dates.B).toMatchObject({ es: 7, ef: 11, float: 5 });
    expect(r.T).toBe(16);
  });

  it('SF with a lead: the bound falls before 0 and the successor starts at 0', () => {
    // A 10 d; B 4 d, SF−2. EF_B ≥ 0 − 2 = −2, ES_B ≥ −6 → 0 (nothing starts before 0), EF_B = 4.
    const r = passOf([act('A'), act('B', [{ id: 'A', type: 'SF', lag: -2 }])], [10, 4]);
    expect(r.dates.B).toMatchObject({ es: 0, ef: 4, float: 6 });
  });

  it('several link types into one activity: the latest bound governs', () => {
    // A1 3 d, A2 10 d; B 4 d with FS+0 from A1 (ES_B ≥ 3) and FF+1 from A2 (EF_B ≥ 11, ES_B ≥ 7):
    // ES_B = 7, EF_B = 11 = T. A1 has LF ≤ LS_B = 7, float 4; A2 LF ≤ LF_B − 1 = 10, float 0.
    const r = passOf([act('A1'), act('A2'), act('B', ['A1', { id: 'A2', type: 'FF', lag: 1 }])], [3, 10, 4]);
    expect(r.dates.B).toMatchObject({ es: 7, ef: 11 });
    expect(r.dates.A1).toMatchObject({ lf: 7, float: 4 });
    expect(r.crit).toEqual(['A2', 'B']);
  });

  it('a plain id and {"id"} without a type mean FS with no lag, as before', () => {
    // A 5 d → B 3 d → C 2 d, finish-to-start: 5 + 3 + 2 = 10.
    const r = passOf([act('A'), act('B', ['A']), act('C', [{ id: 'B' }])], [5, 3, 2]);
    expect(r.dates.C).toMatchObject({ es: 8, ef: 10 });
    expect(r.crit).toEqual(['A', 'B', 'C']);
  });
});

const v2 = (activities: ModelActivity[], extra: Partial<Model> = {}): Model => ({
  format: 'outturn-model',
  version: 2,
  items: [],
  activities,
  ...extra,
});

describe('criticality with link types in a simulation', () => {
  it.each([[['A2', 'A3']], [['A3', 'A2']]])(
    'counts two tied paths through an FF and an SS link whatever the order (%j)',
    (order) => {
      // A1 ~ U(6, 10) days; A2 (4 d) and A3 (6 d) each FF+0 from A1, so both finish with A1
      // (ES = d1 − 4 and d1 − 6, never below 0); A4 (3 d) follows both, T = d1 + 3. Backward:
      // LF_A2 = LF_A3 = LS_A4 = d1 = their EF, LF_A1 ≤ LF_A2 = d1: zero float everywhere, always.
      const res = simulateSync(
        v2([
          { id: 'A1', duration: uniform(6, 10) },
          { id: 'A2', duration: fixed(4), predecessors: [{ id: 'A1', type: 'FF' }] },
          { id: 'A3', duration: fixed(6), predecessors: [{ id: 'A1', type: 'FF' }] },
          { id: 'A4', duration: fixed(3), predecessors: order },
        ]),
        { iterations: 2000, seed: 1 },
      );
      expect(res.criticality).toEqual({ A1: 1, A2: 1, A3: 1, A4: 1 });
      // T = d1 + 3 with d1 ~ U(6, 10): mean 11 (the uniform's mean, 8, plus 3).
      expect(res.duration!.mean).toBeCloseTo(11, 1);
    },
  );

  it('the schedule sensitivity index follows the link types: an SS successor that never drives T has none', () => {
    // A1 U(0, 10), A2 U(0, 2) SS+0 from A1 and A3 1 d FS after A1: A2 finishes by 2 ≤ EF_A3
    // whenever d1 ≥ 1, so it is (almost) never critical and its SSI (criticality × sd ratio) is ~0,
    // while A1 on the chain has SSI = sd(d1)/sd(T) = 1 (T = d1 + 1).
    const res = simulateSync(
      v2([
        { id: 'A1', duration: uniform(0, 10) },
        { id: 'A2', duration: uniform(0, 2), predecessors: [{ id: 'A1', type: 'SS' }] },
        { id: 'A3', duration: fixed(1), predecessors: ['A1'] },
      ]),
      { iterations: 10_000, seed: 5 },
    );
    const ssi = Object.fromEntries(res.sensitivity.duration.map((e) => [e.id, e.ssi]));
    expect(ssi.A1).toBeCloseTo(1, 2);
    // P(A2 critical) = P(d2 ≥ d1 + 1) = ∫ over d1 < 1: (2 − d1 − 1)/2 · (1/10) = 0.025.
    expect(res.criticality.A2).toBeCloseTo(0.025, 2);
  });
});

describe('cycles through any mix of link types', () => {
  it('refuses a cycle through SS and FF links, naming the activities and the links', () => {
    const res = validateModel(
      v2([
        { id: 'A1', duration: fixed(5), predecessors: [{ id: 'A3', type: 'SS', lag: 2 }] },
        { id: 'A2', duration: fixed(5), predecessors: [{ id: 'A1', type: 'FF' }] },
        { id: 'A3', duration: fixed(5), predecessors: ['A2'] },
      ]),
    );
    expect(res.ok).toBe(false);
    if (res.ok) return;
    expect(res.issues).toContainEqual({
      path: 'activities[0] (A1).predecessors',
      message: 'the activities A1 → A2 (FF) → A3 → A1 (SS) form a cycle',
    });
  });

  it('refuses an unknown link type with the allowed ones', () => {
    const res = validateModel(v2([act('A1'), act('A2', [{ id: 'A1', type: 'XX' as 'FS' }])]));
    expect(res.ok).toBe(false);
    if (res.ok) return;
    expect(res.issues[0].path).toBe('activities[1] (A2).predecessors[0] (A1).type');
    expect(res.issues[0].message).toMatch(/"FS" or "SS" or "FF" or "SF"/);
  });
});

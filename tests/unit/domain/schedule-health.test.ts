// The schedule health check on a network built to trip each rule exactly once. The rules are
// common practice in schedule assessment (e.g. the US Defense Contract Management Agency's
// 14-point assessment: missing logic, leads, lags, high duration over 44 working days; and the
// GAO Schedule Assessment Guide on dangling logic), cited from memory.
import { describe, expect, it } from 'vitest';
import { scheduleHealth } from '@/lib/domain/schedule-health';
import type { DistSpec, ModelActivity } from '@/lib/sim';

const tri = (low: number, mode: number, high: number): DistSpec => ({ type: 'triangular', low, mode, high });
const act = (
  id: string,
  duration: DistSpec,
  predecessors: ModelActivity['predecessors'] = [],
): ModelActivity => ({
  id,
  duration,
  predecessors,
});

// S is the project's start and F its finish. Base durations (modes): S 2, A 6, B 10, C 3, D 60,
// E 4, G 3, H 2, X 2, Y 2, F 2. The base critical path is S → A → B → D → F (2 + 6 + 10 + 60 + 2).
const network: ModelActivity[] = [
  act('S', tri(1, 2, 3)),
  act('A', tri(5, 6, 8), ['S']),
  act('B', { type: 'fixed', value: 10 }, ['A']), // no range, on the critical path
  act('C', tri(2, 3, 4), [{ id: 'B', type: 'FF' }]), // dangling start: only an FF link in
  act('D', tri(50, 60, 70), ['B']), // over 44 working days
  act('E', tri(3, 4, 6), [{ id: 'S', type: 'SS', lag: 2 }]), // dangling finish: only an SS link out
  act('G', tri(2, 3, 4), [{ id: 'A', lag: -1 }]), // a lead
  act('H', tri(1, 2, 3), [{ id: 'G', lag: 5 }]), // a lag of 5 days into a 2-day activity
  act('X', tri(1, 2, 3)), // open start
  act('Y', tri(1, 2, 3), ['S']), // open finish
  act('F', tri(1, 2, 3), ['C', 'D', { id: 'E', type: 'SS' }, 'H', 'X']),
];

describe('schedule health check', () => {
  const findings = scheduleHealth(network);
  const byRule = Object.fromEntries(findings.map((f) => [f.rule, f]));

  it('trips each rule once, naming its activities', () => {
    expect(findings.map((f) => [f.rule, f.activities])).toEqual([
      ['open-start', ['X']],
      ['open-finish', ['Y']],
      ['dangling-start', ['C']],
      ['dangling-finish', ['E']],
      ['lead', ['A', 'G']],
      ['long-lag', ['G', 'H']],
      ['long-activity', ['D']],
      ['degenerate-critical', ['B']],
      ['no-uncertainty', ['B']],
    ]);
  });

  it('says what each finding is in words that name the links', () => {
    expect(byRule['open-start'].message).toContain("only the project's start (S)");
    expect(byRule['open-finish'].message).toContain("only the project's finish (F)");
    expect(byRule.lead.message).toContain('A → G (FS−1)');
    expect(byRule['long-lag'].message).toContain('G → H (FS+5), H lasts 2 d');
    expect(byRule['long-activity'].message).toContain('over 44 working days');
    expect(byRule['no-uncertainty'].message).toMatch(/^1 of 11 activities \(9%\)/);
  });

  it('finds nothing in a sound chain with ranges', () => {
    expect(
      scheduleHealth([act('S', tri(1, 2, 3)), act('A', tri(5, 6, 8), ['S']), act('F', tri(1, 2, 3), ['A'])]),
    ).toEqual([]);
  });

  it('does not count a 44-day activity as long, and counts 44.5 days', () => {
    // "Over 44 working days": 44 is the limit itself.
    const at = (d: number) =>
      scheduleHealth([
        act('S', tri(1, 2, 3)),
        act('A', tri(d - 1, d, d + 1), ['S']),
        act('F', tri(1, 2, 3), ['A']),
      ]);
    expect(at(44)).toEqual([]);
    expect(at(44.5).map((f) => f.rule)).toEqual(['long-activity']);
  });

  it('still reports the local rules when the network has a cycle', () => {
    const cyclic = [act('A', tri(1, 2, 3), ['B']), act('B', { type: 'fixed', value: 50 }, ['A'])];
    const rules = scheduleHealth(cyclic).map((f) => f.rule);
    expect(rules).toContain('long-activity');
    expect(rules).not.toContain('degenerate-critical');
  });
});

import { describe, expect, it } from 'vitest';
import { describeAudit } from '@/lib/audit/describe';
import { diffValueText, fieldLabel } from '@/lib/runs/diff-text';

// Common practice for change logs: a record names what changed by the identifier its users
// know (here the WBS code, the risk code, the run's number), and shows values, not data dumps.
describe('the audit trail in words', () => {
  const none = new Map<number, number>();

  it('names a changed line item by its WBS code and lists each field in words and units', () => {
    const text = describeAudit(
      {
        entity: 'cost-item',
        entityId: '2111',
        action: 'update',
        before: { code: '1.2', description: 'Sheet piling', low: 80000, mode: 90000, notes: null },
        after: { code: '1.2', description: 'Sheet piling', low: 85000, mode: 90000, notes: 'Quote in' },
      },
      none,
    );
    expect(text).toEqual({
      what: 'Changed',
      subject: 'line item 1.2 Sheet piling',
      changes: ['Low: 80,000 → 85,000', 'Notes: — → Quote in'],
    });
    expect(JSON.stringify(text)).not.toContain('2111');
  });

  it('writes a risk’s probability as a percentage and a correlation by its pair of codes', () => {
    const risk = describeAudit(
      {
        entity: 'risk-event',
        entityId: '9',
        action: 'update',
        before: { code: 'R4', title: 'Late permit', probability: 0.3 },
        after: { code: 'R4', title: 'Late permit', probability: 0.45 },
      },
      none,
    );
    expect(risk.subject).toBe('risk event R4 Late permit');
    expect(risk.changes).toEqual(['Probability: 30.0 % → 45.0 %']);
    const pair = describeAudit(
      {
        entity: 'correlation',
        entityId: '3',
        action: 'create',
        before: null,
        after: { aCode: 'C1', bCode: 'A2', rho: 0.4 },
      },
      none,
    );
    expect(pair.subject).toBe('correlation C1–A2');
  });

  it('names a run by its number in the project, never its internal id', () => {
    const text = describeAudit(
      {
        entity: 'run',
        entityId: '57',
        action: 'start',
        before: null,
        after: { iterations: 10000, sampling: 'lhs', seed: 4 },
      },
      new Map([[57, 2]]),
    );
    expect(text.subject).toBe('run 2');
    expect(text.changes).toEqual(['10,000 iterations', 'Latin hypercube', 'seed 4']);
  });
});

describe('the inputs that changed between two runs, in words', () => {
  it('writes distributions, probabilities and targets in their units, not as JSON', () => {
    expect(
      diffValueText(
        'item',
        'dist',
        { type: 'pert', low: 3_800_000, mode: 4_200_000, high: 5_400_000 },
        'EUR',
      ),
    ).toBe('PERT 3,800,000 / 4,200,000 / 5,400,000');
    expect(diffValueText('risk', 'probability', 0.3, 'EUR')).toBe('30.0 %');
    expect(diffValueText('risk', 'cost', { type: 'uniform', low: 20_000, high: 80_000 }, 'EUR')).toBe(
      'Uniform 20,000 – 80,000',
    );
    expect(diffValueText('activity', 'predecessors', ['A1', { id: 'A0', lag: 5 }], 'EUR')).toBe(
      'A1, A0 (lag 5)',
    );
    expect(diffValueText('run', 'targets', { cost: 7_500_000, duration: 200 }, 'EUR')).toBe(
      'cost €7,500,000; finish within 200 wd',
    );
    expect(diffValueText('run', 'settings', { iterations: 5000, seed: 11, sampling: 'lhs' }, 'EUR')).toBe(
      '5,000 iterations, Latin hypercube, seed 11',
    );
    expect(fieldLabel('mitigationCost')).toBe('Mitigation cost');
  });
});

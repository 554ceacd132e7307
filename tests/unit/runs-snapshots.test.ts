import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { canonicalJson } from '@/lib/runs/canonical-json';
import { snapshotHash } from '@/lib/runs/snapshot-hash';
import { diffSnapshots } from '@/lib/runs/snapshot-diff';
import type { Model } from '@/lib/sim';

const model = (over: Partial<Model> = {}): Model => ({
  format: 'outturn-model',
  version: 1,
  name: 'Test',
  currency: 'EUR',
  items: [
    { id: 'C1', name: 'Earthworks', dist: { type: 'triangular', low: 90, mode: 100, high: 130 } },
    { id: 'C2', name: 'Pipes', dist: { type: 'pert', low: 40, mode: 50, high: 70 } },
  ],
  risks: [{ id: 'R1', name: 'Rock', probability: 0.3, cost: { type: 'uniform', low: 5, high: 15 } }],
  activities: [{ id: 'A1', name: 'Dig', duration: { type: 'triangular', low: 10, mode: 12, high: 20 } }],
  correlations: [{ a: 'C1', b: 'C2', rho: 0.5 }],
  settings: { iterations: 10000, seed: 7, sampling: 'lhs' },
  ...over,
});

describe('canonical JSON and the snapshot hash', () => {
  it('sorts keys at every level and drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: 1, y: 2 }], c: undefined } })).toBe(
      '{"a":{"d":[3,{"y":2,"z":1}]},"b":1}',
    );
  });

  it('gives the same hash whatever the key order, and another for another content', () => {
    const a = { x: 1, y: [1, 2] };
    const b = { y: [1, 2], x: 1 };
    expect(snapshotHash(a)).toBe(snapshotHash(b));
    expect(snapshotHash(a)).not.toBe(snapshotHash({ x: 1, y: [2, 1] }));
    // Reference: SHA-256 of the text itself, computed by node:crypto directly.
    expect(snapshotHash(a)).toBe(createHash('sha256').update('{"x":1,"y":[1,2]}').digest('hex'));
    expect(snapshotHash(a)).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('diff of two snapshots', () => {
  it('finds nothing between equal models', () => {
    expect(diffSnapshots(model(), model())).toEqual({ lines: [], other: [] });
  });

  it('lists added, removed and changed lines by id, with the changed fields', () => {
    const before = model();
    const after = model({
      items: [
        { id: 'C1', name: 'Earthworks', dist: { type: 'triangular', low: 90, mode: 105, high: 130 } },
        { id: 'C3', name: 'Valves', base: 20 },
      ],
      risks: [{ id: 'R1', name: 'Rock', probability: 0.2, cost: { type: 'uniform', low: 5, high: 15 } }],
      // The same pair written the other way round is the same line.
      correlations: [{ a: 'C2', b: 'C1', rho: 0.5 }],
      settings: { iterations: 20000, seed: 7, sampling: 'lhs' },
    });
    const diff = diffSnapshots(before, after);
    const byKey = Object.fromEntries(diff.lines.map((l) => [`${l.kind}:${l.id}`, l]));
    expect(Object.keys(byKey).sort()).toEqual(['item:C1', 'item:C2', 'item:C3', 'risk:R1']);
    expect(byKey['item:C1'].change).toBe('changed');
    expect(byKey['item:C1'].fields.map((f) => f.field)).toEqual(['dist']);
    expect(byKey['item:C2'].change).toBe('removed');
    expect(byKey['item:C3'].change).toBe('added');
    expect(byKey['risk:R1'].fields).toEqual([{ field: 'probability', before: 0.3, after: 0.2 }]);
    expect(diff.other.map((o) => o.field)).toEqual(['settings']);
  });
});

// The network diagram's layout: every link points right (a predecessor's column is left of its
// successor's), and the highlighted path follows the run's criticality back from the finish.
import { describe, expect, it } from 'vitest';
import { layoutNetwork } from '@/components/schedule/network-layout';
import type { ModelActivity } from '@/lib/sim';

const tri = (mode: number) => ({ type: 'triangular' as const, low: mode - 1, mode, high: mode + 2 });
const network: ModelActivity[] = [
  { id: 'A1', duration: tri(5) },
  { id: 'A2', duration: tri(10), predecessors: ['A1'] },
  { id: 'A3', duration: tri(8), predecessors: [{ id: 'A1', type: 'SS', lag: 2 }] },
  { id: 'A4', duration: tri(3), predecessors: ['A2', 'A3'] },
];

describe('network diagram layout', () => {
  it('puts every predecessor in a column left of its successor and labels typed links', () => {
    const layout = layoutNetwork(network, null);
    expect(layout.ok).toBe(true);
    if (!layout.ok) return;
    const x = Object.fromEntries(layout.boxes.map((b) => [b.id, b.x]));
    for (const l of layout.links) expect(x[l.from]).toBeLessThan(x[l.to]);
    expect(layout.links.find((l) => l.to === 'A3')!.label).toBe('SS+2');
    expect(layout.links.find((l) => l.to === 'A2')!.label).toBe('');
  });

  it('before a run, highlights the base critical path (A1 → A2 → A4: 5 + 10 + 3 against 2 + 8 + 3 via A3)', () => {
    const layout = layoutNetwork(network, null);
    if (!layout.ok) throw new Error(layout.reason);
    expect(layout.boxes.filter((b) => b.highlighted).map((b) => b.id)).toEqual(['A1', 'A2', 'A4']);
  });

  it('after a run, follows the most critical predecessor back from the finish', () => {
    const layout = layoutNetwork(network, { A1: 1, A2: 0.3, A3: 0.7, A4: 1 });
    if (!layout.ok) throw new Error(layout.reason);
    expect(layout.boxes.filter((b) => b.highlighted).map((b) => b.id)).toEqual(['A1', 'A3', 'A4']);
    expect(layout.links.filter((l) => l.highlighted).map((l) => `${l.from}-${l.to}`)).toEqual([
      'A1-A3',
      'A3-A4',
    ]);
  });

  it('follows the driving link among predecessors tied in criticality, not a shortcut', () => {
    // A1 → A2 → A4 and a lagged A1 → A4 (SS+1) that never drives: all three always critical
    // (to within noise), so the path runs A1 → A2 → A4, not straight from A1.
    const tied: ModelActivity[] = [
      { id: 'A1', duration: tri(5) },
      { id: 'A2', duration: tri(10), predecessors: ['A1'] },
      { id: 'A4', duration: tri(3), predecessors: [{ id: 'A1', type: 'SS', lag: 1 }, 'A2'] },
    ];
    const layout = layoutNetwork(tied, { A1: 1, A2: 0.998, A4: 1 });
    if (!layout.ok) throw new Error(layout.reason);
    expect(layout.links.filter((l) => l.highlighted).map((l) => `${l.from}-${l.to}`)).toEqual([
      'A1-A2',
      'A2-A4',
    ]);
  });

  it('waits for a sound network, saying why', () => {
    const layout = layoutNetwork([{ id: 'A1', duration: tri(2), predecessors: ['A1'] }], null);
    expect(layout).toEqual({
      ok: false,
      reason: 'The diagram waits for a sound network: A1 cannot precede itself.',
    });
  });
});

// Where the network diagram puts each activity and link: columns by the number of links on the
// longest chain of predecessors before it (so every link points right), rows in the schedule's
// order within a column; and the path to highlight, from a run's criticality (the finish that
// was most often critical, then back through the predecessor most often critical) or, before
// any run, the base schedule's zero-float activities.
import { baseDurationOf, checkNetwork, scheduleDates, type ModelActivity } from '@/lib/sim';

export const BOX = { width: 156, height: 50, columnGap: 64, rowGap: 16, margin: 12 };
/** Room above the boxes for links that skip a column (they arc over the boxes between). */
const ARC_LANE = 34;

export type DiagramBox = {
  id: string;
  name: string;
  days: number;
  existence: number;
  criticality: number | null;
  x: number;
  y: number;
  highlighted: boolean;
};

export type DiagramLink = {
  from: string;
  to: string;
  label: string;
  highlighted: boolean;
  path: string;
  /** Where its label goes: the middle of the curve. */
  labelX: number;
  labelY: number;
};

export type DiagramLayout =
  | { ok: true; boxes: DiagramBox[]; links: DiagramLink[]; width: number; height: number }
  | { ok: false; reason: string };

const lagText = (lag: number) => (lag > 0 ? `+${lag}` : lag < 0 ? `−${-lag}` : '');

function baseDays(a: ModelActivity): number {
  try {
    return baseDurationOf(a.duration);
  } catch {
    return 0;
  }
}

export function layoutNetwork(
  activities: readonly ModelActivity[],
  criticality: Record<string, number> | null,
): DiagramLayout {
  if (activities.length === 0) return { ok: false, reason: 'No activities yet.' };
  const problems = checkNetwork([...activities]);
  if (problems.length)
    return { ok: false, reason: `The diagram waits for a sound network: ${problems[0].message}.` };
  const links = activities.flatMap((a) =>
    (a.predecessors ?? []).map((p) =>
      typeof p === 'string'
        ? { from: p, to: a.id, type: 'FS', lag: 0 }
        : { from: p.id, to: a.id, type: p.type ?? 'FS', lag: p.lag ?? 0 },
    ),
  );
  const durations = activities.map(baseDays);
  const dates = scheduleDates([...activities], durations);
  const preds = new Map(activities.map((a) => [a.id, links.filter((l) => l.to === a.id).map((l) => l.from)]));

  // Columns: 1 + the deepest predecessor's column (a topological order exists: no cycle).
  const column = new Map<string, number>();
  const columnOf = (id: string): number => {
    const known = column.get(id);
    if (known !== undefined) return known;
    const c = Math.max(-1, ...preds.get(id)!.map(columnOf)) + 1;
    column.set(id, c);
    return c;
  };
  activities.forEach((a) => columnOf(a.id));
  const rowsUsed: number[] = [];
  const place = new Map<string, { x: number; y: number }>();
  for (const a of activities) {
    const c = column.get(a.id)!;
    const r = (rowsUsed[c] = (rowsUsed[c] ?? 0) + 1) - 1;
    place.set(a.id, {
      x: BOX.margin + c * (BOX.width + BOX.columnGap),
      y: BOX.margin + ARC_LANE + r * (BOX.height + BOX.rowGap),
    });
  }

  // A link drives its successor in the base schedule when its bound is the successor's early start.
  const dateOf = (id: string) => dates.activities[id];
  const driving = links.map((l) => {
    const p = dateOf(l.from);
    const a = dateOf(l.to);
    const fromStart = l.type === 'SS' || l.type === 'SF';
    const onFinish = l.type === 'FF' || l.type === 'SF';
    const bound =
      (fromStart ? p.earlyStart : p.earlyFinish) + l.lag - (onFinish ? a.earlyFinish - a.earlyStart : 0);
    return { from: l.from, to: l.to, driving: Math.abs(bound - a.earlyStart) < 1e-9 };
  });
  const onPath = highlightedActivities(activities, driving, criticality, (id) => dateOf(id).critical);
  const boxes: DiagramBox[] = activities.map((a, i) => ({
    id: a.id,
    name: a.name ?? '',
    days: durations[i],
    existence: a.existence ?? 1,
    criticality: criticality ? (criticality[a.id] ?? 0) : null,
    ...place.get(a.id)!,
    highlighted: onPath.nodes.has(a.id),
  }));
  // Two links between the same activities (an SS and an FF pair) share one arrow and one label.
  const pairs = new Map<string, { from: string; to: string; labels: string[] }>();
  for (const l of links) {
    const key = `${l.from}\u0000${l.to}`;
    const pair = pairs.get(key) ?? { from: l.from, to: l.to, labels: [] };
    if (l.type !== 'FS' || l.lag !== 0) pair.labels.push(`${l.type}${lagText(l.lag)}`);
    pairs.set(key, pair);
  }
  const diagramLinks: DiagramLink[] = [...pairs.values()].map((l) => {
    const from = place.get(l.from)!;
    const to = place.get(l.to)!;
    const x1 = from.x + BOX.width;
    const y1 = from.y + BOX.height / 2;
    const x2 = to.x - 2;
    const y2 = to.y + BOX.height / 2;
    const skips = column.get(l.to)! - column.get(l.from)! > 1;
    const bend = Math.max(24, (x2 - x1) / 2);
    // A link over a column arcs above the boxes between, so that no box hides it.
    const top = Math.min(y1, y2) - BOX.height / 2 - ARC_LANE * 0.9;
    const path = skips
      ? `M ${x1} ${y1} C ${x1 + 40} ${top}, ${x2 - 40} ${top}, ${x2} ${y2}`
      : `M ${x1} ${y1} C ${x1 + bend} ${y1}, ${x2 - bend} ${y2}, ${x2} ${y2}`;
    return {
      from: l.from,
      to: l.to,
      label: l.labels.join(' · '),
      highlighted: onPath.edges.has(edgeKey(l.from, l.to)),
      path,
      labelX: (x1 + x2) / 2,
      labelY: skips ? 0.125 * (y1 + y2) + 0.75 * top - 3 : (y1 + y2) / 2 - 4,
    };
  });
  const columns = Math.max(...column.values()) + 1;
  const rows = Math.max(...rowsUsed);
  return {
    ok: true,
    boxes,
    links: diagramLinks,
    width: 2 * BOX.margin + columns * BOX.width + (columns - 1) * BOX.columnGap,
    height: 2 * BOX.margin + ARC_LANE + rows * BOX.height + (rows - 1) * BOX.rowGap,
  };
}

const edgeKey = (from: string, to: string) => `${from}\u0000${to}`;

/** Two criticalities this close count as a tie (Monte Carlo noise of a few iterations). */
const TIE = 0.01;

/**
 * With a run: the finish most often critical, then back through the predecessor most often
 * critical, to a start. Among predecessors tied within TIE, the one whose link drives the
 * successor's start in the base schedule wins (then the first listed): so a chain that is always
 * critical is followed link by link rather than cut short by a link that merely ties. Before a
 * run: the base schedule's critical activities.
 */
function highlightedActivities(
  activities: readonly ModelActivity[],
  links: { from: string; to: string; driving: boolean }[],
  criticality: Record<string, number> | null,
  baseCritical: (id: string) => boolean,
): { nodes: Set<string>; edges: Set<string> } {
  if (!criticality) {
    const nodes = new Set(activities.filter((a) => baseCritical(a.id)).map((a) => a.id));
    const edges = links.filter((l) => l.driving && nodes.has(l.from) && nodes.has(l.to));
    return { nodes, edges: new Set(edges.map((l) => edgeKey(l.from, l.to))) };
  }
  const c = (id: string) => criticality[id] ?? 0;
  const hasSucc = new Set(links.map((l) => l.from));
  const finishes = activities.filter((a) => !hasSucc.has(a.id)).map((a) => a.id);
  let at: string | undefined = finishes.reduce((best, id) => (c(id) > c(best) ? id : best), finishes[0]);
  const nodes = new Set<string>();
  const edges = new Set<string>();
  while (at !== undefined && !nodes.has(at) && c(at) > 0) {
    nodes.add(at);
    const into = links.filter((l) => l.to === at);
    const top = Math.max(...into.map((l) => c(l.from)));
    const tied = into.filter((l) => c(l.from) >= top - TIE);
    const next = tied.find((l) => l.driving) ?? tied[0];
    if (next && c(next.from) > 0) edges.add(edgeKey(next.from, at));
    at = next?.from;
  }
  return { nodes, edges };
}

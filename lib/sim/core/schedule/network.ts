/**
 * The activity network, finish-to-start with lags, prepared once per model: predecessor lists in
 * compressed rows (CSR) and a topological order by Kahn's algorithm (Kahn 1962, "Topological
 * sorting of large networks", Communications of the ACM 5(11):558–562). A reference to an unknown
 * activity or a cycle is reported with the activities named.
 */

import type { ModelActivity } from '../formats';

export interface Network {
  size: number;
  /** Activity indices in an order where every predecessor comes first. */
  order: Int32Array;
  /** Predecessors of activity a: predIndex[predStart[a] … predStart[a+1]−1], with their lags. */
  predStart: Int32Array;
  predIndex: Int32Array;
  predLag: Float64Array;
  /** 1 when no activity follows it (the project finish is the latest of these). */
  isSink: Uint8Array;
}

export interface NetworkProblem {
  /** Path inside the model, e.g. ['activities', 4, 'predecessors', 1]. */
  path: (string | number)[];
  message: string;
}

const predId = (p: NonNullable<ModelActivity['predecessors']>[number]) => (typeof p === 'string' ? p : p.id);
const predLag = (p: NonNullable<ModelActivity['predecessors']>[number]) =>
  typeof p === 'string' ? 0 : (p.lag ?? 0);

/** Problems with the network (unknown or repeated predecessors, cycles); empty when it is sound. */
export function checkNetwork(activities: ModelActivity[]): NetworkProblem[] {
  const problems: NetworkProblem[] = [];
  const index = new Map(activities.map((a, i) => [a.id, i]));
  activities.forEach((a, i) => {
    const seen = new Set<string>();
    (a.predecessors ?? []).forEach((p, j) => {
      const id = predId(p);
      const path = ['activities', i, 'predecessors', j];
      if (!index.has(id)) problems.push({ path, message: `unknown activity "${id}"` });
      else if (id === a.id) problems.push({ path, message: `${a.id} cannot precede itself` });
      else if (seen.has(id)) problems.push({ path, message: `${id} is listed twice` });
      seen.add(id);
    });
  });
  if (problems.length) return problems;
  const cycle = findCycle(activities, index);
  if (cycle) {
    const first = index.get(cycle[0])!;
    problems.push({
      path: ['activities', first, 'predecessors'],
      message: `the activities ${cycle.join(' → ')} → ${cycle[0]} form a cycle`,
    });
  }
  return problems;
}

/** One cycle (as activity ids in precedence order) or null; depth-first search with colours. */
function findCycle(activities: ModelActivity[], index: Map<string, number>): string[] | null {
  const colour = new Uint8Array(activities.length); // 0 new, 1 on stack, 2 done
  const stack: number[] = [];
  const visit = (a: number): string[] | null => {
    colour[a] = 1;
    stack.push(a);
    for (const p of activities[a].predecessors ?? []) {
      const b = index.get(predId(p))!;
      if (colour[b] === 1) {
        // In precedence order, starting from the activity listed first in the model.
        const cyc = stack.slice(stack.indexOf(b)).reverse();
        const first = cyc.indexOf(Math.min(...cyc));
        return [...cyc.slice(first), ...cyc.slice(0, first)].map((k) => activities[k].id);
      }
      if (colour[b] === 0) {
        const found = visit(b);
        if (found) return found;
      }
    }
    stack.pop();
    colour[a] = 2;
    return null;
  };
  for (let a = 0; a < activities.length; a++) {
    if (colour[a] === 0) {
      const found = visit(a);
      if (found) return found;
    }
  }
  return null;
}

/** Builds the network of a model whose activities passed checkNetwork. */
export function buildNetwork(activities: ModelActivity[]): Network {
  const problems = checkNetwork(activities);
  if (problems.length) throw new Error(problems[0].message);
  const size = activities.length;
  const index = new Map(activities.map((a, i) => [a.id, i]));
  const predStart = new Int32Array(size + 1);
  activities.forEach((a, i) => (predStart[i + 1] = predStart[i] + (a.predecessors?.length ?? 0)));
  const predIndex = new Int32Array(predStart[size]);
  const predLagArr = new Float64Array(predStart[size]);
  const isSink = new Uint8Array(size).fill(1);
  activities.forEach((a, i) =>
    (a.predecessors ?? []).forEach((p, j) => {
      const b = index.get(predId(p))!;
      predIndex[predStart[i] + j] = b;
      predLagArr[predStart[i] + j] = predLag(p);
      isSink[b] = 0;
    }),
  );
  // Kahn: repeatedly place an activity whose predecessors are all placed (a stack, so the
  // order depends only on the model).
  const successors: number[][] = activities.map(() => []);
  const indegree = new Int32Array(size);
  for (let a = 0; a < size; a++) {
    indegree[a] = predStart[a + 1] - predStart[a];
    for (let e = predStart[a]; e < predStart[a + 1]; e++) successors[predIndex[e]].push(a);
  }
  const order = new Int32Array(size);
  const ready: number[] = [];
  for (let a = size - 1; a >= 0; a--) if (indegree[a] === 0) ready.push(a);
  let placed = 0;
  while (ready.length) {
    const a = ready.pop()!;
    order[placed++] = a;
    for (const s of successors[a]) {
      if (--indegree[s] === 0) ready.push(s);
    }
  }
  return { size, order, predStart, predIndex, predLag: predLagArr, isSink };
}

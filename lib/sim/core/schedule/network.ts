/**
 * The activity network, prepared once per model: predecessor lists in compressed rows (CSR) with
 * each link's type (FS, SS, FF, SF) and lag, and a topological order by Kahn's algorithm (Kahn
 * 1962, "Topological sorting of large networks", Communications of the ACM 5(11):558–562). Every
 * link type orders its two activities the same way (the predecessor's dates are known before the
 * successor's), so one order serves them all. A reference to an unknown activity or a cycle
 * through any mix of link types is reported with the activities named.
 */

import type { LinkType, ModelActivity } from '../formats';

/** Link type codes in Network.predType. */
export const LINK = { FS: 0, SS: 1, FF: 2, SF: 3 } as const;
const LINK_CODE: Record<LinkType, number> = LINK;

export interface Network {
  size: number;
  /** Activity indices in an order where every predecessor comes first. */
  order: Int32Array;
  /** Predecessors of activity a: predIndex[predStart[a] … predStart[a+1]−1], with their lags. */
  predStart: Int32Array;
  predIndex: Int32Array;
  predLag: Float64Array;
  /** Link type of each predecessor entry (LINK codes). */
  predType: Uint8Array;
  /** True when some link is not finish-to-start (the passes then take the general route). */
  mixedLinks: boolean;
  /** 1 when no activity follows it (the project finish is the latest of these). */
  isSink: Uint8Array;
  /**
   * 1 for the link that reaches its predecessor first in the backward pass (reverse order): the
   * one that writes the predecessor's late finish rather than lowering it.
   */
  firstLink: Uint8Array;
  /**
   * 0 when the activity has a predecessor and a finish-to-start successor with a lag ≥ 0: with
   * durations ≥ 0 that successor finishes no earlier, so the activity is never alone the last
   * to finish, and the project duration (the latest finish) can pass it by. 1 otherwise. An
   * activity without predecessors keeps 1: its finish is its duration alone (0 may be −0 there).
   */
  canFinishLast: Uint8Array;
}

export interface NetworkProblem {
  /** Path inside the model, e.g. ['activities', 4, 'predecessors', 1]. */
  path: (string | number)[];
  message: string;
}

const predId = (p: NonNullable<ModelActivity['predecessors']>[number]) => (typeof p === 'string' ? p : p.id);
const predLag = (p: NonNullable<ModelActivity['predecessors']>[number]) =>
  typeof p === 'string' ? 0 : (p.lag ?? 0);
const predType = (p: NonNullable<ModelActivity['predecessors']>[number]): LinkType =>
  typeof p === 'string' ? 'FS' : (p.type ?? 'FS');

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
      else if (seen.has(`${id} ${predType(p)}`)) {
        // One link of each type between two activities (an SS and an FF pair is common).
        problems.push({ path, message: `${id} is listed twice` });
      }
      seen.add(`${id} ${predType(p)}`);
    });
  });
  if (problems.length) return problems;
  const cycle = findCycle(activities, index);
  if (cycle) {
    const first = index.get(cycle[0])!;
    problems.push({
      path: ['activities', first, 'predecessors'],
      message: `the activities ${cycle.join(' → ')} form a cycle`,
    });
  }
  return problems;
}

/**
 * One cycle or null: the activity ids in precedence order, each arrow labelled with its link type
 * when not FS, back to the first ("A1 → A2 (SS) → A3 (FF) → A1"); depth-first search with colours.
 */
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
        const ordered = [...cyc.slice(first), ...cyc.slice(0, first)];
        return [...ordered, ordered[0]].map((k, j) => {
          if (j === 0) return activities[k].id;
          const link = (activities[k].predecessors ?? []).find(
            (q) => predId(q) === activities[ordered[j - 1]].id,
          )!;
          const type = predType(link);
          return type === 'FS' ? activities[k].id : `${activities[k].id} (${type})`;
        });
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
  const predTypeArr = new Uint8Array(predStart[size]);
  const isSink = new Uint8Array(size).fill(1);
  activities.forEach((a, i) =>
    (a.predecessors ?? []).forEach((p, j) => {
      const b = index.get(predId(p))!;
      predIndex[predStart[i] + j] = b;
      predLagArr[predStart[i] + j] = predLag(p);
      predTypeArr[predStart[i] + j] = LINK_CODE[predType(p)];
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
  const firstLink = new Uint8Array(predStart[size]);
  const reached = new Uint8Array(size);
  for (let k = size - 1; k >= 0; k--) {
    const a = order[k];
    for (let j = predStart[a]; j < predStart[a + 1]; j++) {
      if (!reached[predIndex[j]]) firstLink[j] = reached[predIndex[j]] = 1;
    }
  }
  const canFinishLast = new Uint8Array(size).fill(1);
  for (let a = 0; a < size; a++) {
    for (let j = predStart[a]; j < predStart[a + 1]; j++) {
      const p = predIndex[j];
      if (predTypeArr[j] === LINK.FS && predLagArr[j] >= 0 && predStart[p + 1] > predStart[p])
        canFinishLast[p] = 0;
    }
  }
  return {
    size,
    order,
    firstLink,
    canFinishLast,
    predStart,
    predIndex,
    predLag: predLagArr,
    predType: predTypeArr,
    mixedLinks: predTypeArr.some((t) => t !== LINK.FS),
    isSink,
  };
}

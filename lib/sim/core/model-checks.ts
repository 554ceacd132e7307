// Model-level rules that a schema of single fields cannot express: unique ids, references
// between entries, the network, and the correlation list. Each problem carries the path of the
// entry at fault inside the model so the message can name it.

import { createDistribution } from './distributions';
import { existenceInput } from './schedule/branches';
import { checkNetwork } from './schedule/network';
import type { Model } from './formats';

export interface ModelProblem {
  path: (string | number)[];
  message: string;
}

type Section = 'items' | 'risks' | 'activities' | 'drivers';

export function checkModel(model: Model): ModelProblem[] {
  const problems: ModelProblem[] = [];
  const add = (path: (string | number)[], message: string) => problems.push({ path, message });
  const owner = new Map<string, string>();
  const sections: [Section, { id: string }[]][] = [
    ['items', model.items],
    ['risks', model.risks ?? []],
    ['activities', model.activities ?? []],
    ['drivers', model.drivers ?? []],
  ];
  for (const [section, list] of sections) {
    list.forEach((e, i) => {
      const here = `${section}[${i}]`;
      const prev = owner.get(e.id);
      if (prev) add([section, i, 'id'], `duplicate id "${e.id}" (also ${prev})`);
      else owner.set(e.id, here);
    });
  }
  const activityIds = new Set((model.activities ?? []).map((a) => a.id));
  // A probabilistic branch's existence can be correlated like a risk, by the name "A5 (existence)".
  (model.activities ?? []).forEach((a, i) => {
    if (a.existence === undefined) return;
    const name = existenceInput(a.id);
    if (owner.has(name))
      add(['activities', i, 'existence'], `"${name}" is also the id of ${owner.get(name)}`);
    else owner.set(name, `activities[${i}].existence`);
  });
  const itemIds = new Set(model.items.map((c) => c.id));

  model.items.forEach((item, i) => {
    const hasRate = item.ratePerDay !== undefined;
    const projectSpan = item.span === 'project';
    if (item.dist && hasRate) add(['items', i], 'give either dist or ratePerDay, not both');
    else if (!item.dist && !hasRate && item.base === undefined) {
      add(['items', i], 'needs a dist (or a base for a fixed amount), or a ratePerDay with an activity');
    }
    if (projectSpan && !hasRate) add(['items', i, 'span'], 'is only used with ratePerDay');
    if (projectSpan && item.activity !== undefined) {
      add(['items', i, 'activity'], 'is not used with span "project" (the rate runs with the whole project)');
    } else if (projectSpan && activityIds.size === 0) {
      add(['items', i, 'span'], 'needs activities (the project duration comes from the schedule)');
    }
    if (hasRate && !projectSpan && item.activity === undefined)
      add(['items', i, 'activity'], 'is required with ratePerDay');
    if (!hasRate && item.activity !== undefined)
      add(['items', i, 'activity'], 'is only used with ratePerDay');
    if (item.activity !== undefined && !activityIds.has(item.activity)) {
      add(['items', i, 'activity'], `unknown activity "${item.activity}"`);
    }
  });

  (model.risks ?? []).forEach((r, i) => {
    if (!r.cost && !r.delay) add(['risks', i], 'needs a cost or a delay (or both)');
    if (r.activity !== undefined && r.activities !== undefined) {
      add(['risks', i, 'activities'], 'give either activity or activities, not both');
    }
    const acts = r.activities ?? (r.activity !== undefined ? [r.activity] : []);
    if (r.delay && acts.length === 0) {
      add(['risks', i, r.activities ? 'activities' : 'activity'], 'is required with a delay');
    }
    if (r.activity !== undefined && !activityIds.has(r.activity)) {
      add(['risks', i, 'activity'], `unknown activity "${r.activity}"`);
    }
    checkIdList(r.activities, ['risks', i, 'activities'], activityIds, 'activity', add);
    checkIdList(r.items, ['risks', i, 'items'], itemIds, 'line item', add);
    if (r.post) {
      if (r.post.cost && !r.cost) add(['risks', i, 'post', 'cost'], 'the risk has no cost before mitigation');
      if (r.post.delay && !r.delay)
        add(['risks', i, 'post', 'delay'], 'the risk has no delay before mitigation');
    }
  });

  (model.drivers ?? []).forEach((d, i) => {
    d.applies.forEach((target, j) => {
      const path = ['drivers', i, 'applies', j];
      const kind = owner.get(target);
      if (!kind) add(path, `unknown input "${target}"`);
      else if (!itemIds.has(target) && !activityIds.has(target)) {
        add(path, `"${target}" is not a line item or an activity (${kind}); a driver scales those only`);
      }
      if (d.applies.indexOf(target) !== j) add(path, `"${target}" is listed twice`);
    });
    const below = factorBelowZero(d.factor);
    if (below) add(['drivers', i, 'factor'], below);
  });

  problems.push(...checkNetwork(model.activities ?? []));

  const pairs = new Map<string, string>();
  (model.correlations ?? []).forEach((c, i) => {
    if (!owner.has(c.a)) add(['correlations', i, 'a'], `unknown input "${c.a}"`);
    if (!owner.has(c.b)) add(['correlations', i, 'b'], `unknown input "${c.b}"`);
    if (c.a === c.b) add(['correlations', i, 'b'], `an input cannot be correlated with itself ("${c.a}")`);
    const key = [c.a, c.b].sort().join('\u0000');
    const prev = pairs.get(key);
    if (prev !== undefined) add(['correlations', i], `the pair ${c.a}–${c.b} is already given in ${prev}`);
    else pairs.set(key, `correlations[${i}] (${c.a}–${c.b})`);
  });
  return problems;
}

function checkIdList(
  list: string[] | undefined,
  path: (string | number)[],
  known: Set<string>,
  what: string,
  add: (path: (string | number)[], message: string) => void,
): void {
  (list ?? []).forEach((ref, j) => {
    if (!known.has(ref)) add([...path, j], `unknown ${what} "${ref}"`);
    else if (list!.indexOf(ref) !== j) add([...path, j], `"${ref}" is listed twice`);
  });
}

/** Why a driver's factor distribution is refused (it can go below zero), or null. */
function factorBelowZero(spec: NonNullable<Model['drivers']>[number]['factor']): string | null {
  let low: number;
  try {
    low = createDistribution(spec, { where: '', field: '' }).support[0];
  } catch {
    return null; // the distribution's own fields are reported by the schema
  }
  if (low < 0) {
    return `can go below zero (lowest value ${Number.isFinite(low) ? low : '−∞'}); a factor must be at least 0`;
  }
  return null;
}

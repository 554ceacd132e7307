// Model-level rules that a schema of single fields cannot express: unique ids, references
// between entries, the network, and the correlation list. Each problem carries the path of the
// entry at fault inside the model so the message can name it.

import { checkNetwork } from './schedule/network';
import type { Model } from './formats';

export interface ModelProblem {
  path: (string | number)[];
  message: string;
}

type Section = 'items' | 'risks' | 'activities';

export function checkModel(model: Model): ModelProblem[] {
  const problems: ModelProblem[] = [];
  const add = (path: (string | number)[], message: string) => problems.push({ path, message });
  const owner = new Map<string, string>();
  const sections: [Section, { id: string }[]][] = [
    ['items', model.items],
    ['risks', model.risks ?? []],
    ['activities', model.activities ?? []],
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

  model.items.forEach((item, i) => {
    const hasRate = item.ratePerDay !== undefined;
    if (item.dist && hasRate) add(['items', i], 'give either dist or ratePerDay, not both');
    else if (!item.dist && !hasRate && item.base === undefined) {
      add(['items', i], 'needs a dist (or a base for a fixed amount), or a ratePerDay with an activity');
    }
    if (hasRate && item.activity === undefined) add(['items', i, 'activity'], 'is required with ratePerDay');
    if (!hasRate && item.activity !== undefined)
      add(['items', i, 'activity'], 'is only used with ratePerDay');
    if (item.activity !== undefined && !activityIds.has(item.activity)) {
      add(['items', i, 'activity'], `unknown activity "${item.activity}"`);
    }
  });

  (model.risks ?? []).forEach((r, i) => {
    if (!r.cost && !r.delay) add(['risks', i], 'needs a cost or a delay (or both)');
    if (r.delay && r.activity === undefined) add(['risks', i, 'activity'], 'is required with a delay');
    if (r.activity !== undefined && !activityIds.has(r.activity)) {
      add(['risks', i, 'activity'], `unknown activity "${r.activity}"`);
    }
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

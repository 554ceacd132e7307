// Small model builders for the engine's tests.
import type { DistSpec, Model, ModelActivity, ModelCorrelation, ModelItem, ModelRisk } from '../formats';

export function model(parts: {
  items?: ModelItem[];
  risks?: ModelRisk[];
  activities?: ModelActivity[];
  correlations?: ModelCorrelation[];
  targets?: Model['targets'];
}): Model {
  return { format: 'outturn-model', version: 1, name: 'test', currency: 'EUR', items: [], ...parts };
}

export const normal = (mean: number, sd: number): DistSpec => ({ type: 'normal', mean, sd });
export const fixed = (value: number): DistSpec => ({ type: 'fixed', value });
export const uniform = (low: number, high: number): DistSpec => ({ type: 'uniform', low, high });
export const item = (id: string, dist: DistSpec): ModelItem => ({ id, dist });

/** Spearman's coefficient by sorting, with average ranks for ties (independent of the engine). */
export function spearmanBySorting(x: ArrayLike<number>, y: ArrayLike<number>): number {
  const ranks = (v: ArrayLike<number>) => {
    const idx = Array.from({ length: v.length }, (_, i) => i).sort((a, b) => v[a] - v[b]);
    const r = new Float64Array(v.length);
    for (let i = 0; i < idx.length;) {
      let j = i;
      while (j + 1 < idx.length && v[idx[j + 1]] === v[idx[i]]) j++;
      for (let k = i; k <= j; k++) r[idx[k]] = (i + j) / 2;
      i = j + 1;
    }
    return r;
  };
  const rx = ranks(x);
  const ry = ranks(y);
  const n = rx.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += rx[i] / n;
    my += ry[i] / n;
  }
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (rx[i] - mx) * (ry[i] - my);
    sxx += (rx[i] - mx) ** 2;
    syy += (ry[i] - my) ** 2;
  }
  return sxy / Math.sqrt(sxx * syy);
}

export function sampleSd(xs: number[]): number {
  const m = xs.reduce((s, x) => s + x, 0) / xs.length;
  return Math.sqrt(xs.reduce((s, x) => s + (x - m) ** 2, 0) / (xs.length - 1));
}

/**
 * A histogram of doubles by bucket key (./keys) with integer counts: adding and merging are
 * exact and independent of order, so histograms of any split of a run merge into the run's own.
 * In JSON it is two plain arrays, keys ascending.
 */

export interface HistogramJson {
  keys: number[];
  counts: number[];
}

export class Histogram {
  readonly counts = new Map<number, number>();

  add(key: number, count = 1): void {
    this.counts.set(key, (this.counts.get(key) ?? 0) + count);
  }

  merge(json: HistogramJson): this {
    for (let k = 0; k < json.keys.length; k++) this.add(json.keys[k], json.counts[k]);
    return this;
  }

  toJSON(): HistogramJson {
    const keys = [...this.counts.keys()].sort((a, b) => a - b);
    return { keys, counts: keys.map((k) => this.counts.get(k)!) };
  }
}

/** A histogram's buckets in order with the count of values below each: ranks to buckets. */
export class Cumulative {
  readonly keys: number[];
  readonly counts: number[];
  /** below[j]: values in buckets before j. */
  readonly below: number[];
  readonly n: number;

  constructor(json: HistogramJson) {
    this.keys = json.keys;
    this.counts = json.counts;
    this.below = new Array(json.keys.length);
    let acc = 0;
    for (let j = 0; j < json.keys.length; j++) {
      this.below[j] = acc;
      acc += json.counts[j];
    }
    this.n = acc;
  }

  /** Index of the bucket holding the value of 1-based rank k. */
  bucketOfRank(k: number): number {
    let lo = 0;
    let hi = this.keys.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (this.below[mid] < k) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  /** Mid-rank (1-based) of bucket j: the average rank of its values, as if tied. */
  midRank(j: number): number {
    return this.below[j] + (this.counts[j] + 1) / 2;
  }
}

export function mergeHistograms(parts: (HistogramJson | null)[]): HistogramJson | null {
  if (parts.some((p) => p === null)) return null;
  const h = new Histogram();
  for (const p of parts) h.merge(p!);
  return h.toJSON();
}

/**
 * Axis scales for the outcome charts: tick values a reader can add up in their head (the "nice
 * numbers" of lib/brief/chart-geometry, steps of 1, 2 or 5 × 10^k), the extent of an axis of
 * signed values (a half axis when every value has the same sign), and where a value such as a
 * target lies against a plotted range.
 */
import { niceTicks } from '@/lib/brief/chart-geometry';

export type Ticks = { min: number; max: number; step: number; values: number[] };

/** About `count` nice ticks from at or below lo to at or above hi. */
export function ticksOver(lo: number, hi: number, count = 5): Ticks {
  const values = niceTicks(lo, hi, count);
  if (values.length < 2) return { min: 0, max: 1, step: 1, values: [0, 1] };
  return { min: values[0], max: values[values.length - 1], step: values[1] - values[0], values };
}

/**
 * An axis over the data itself, [lo, hi] padded by `pad` of its span on each side, with the nice
 * ticks that fall inside it: no empty stretch out to the next round number.
 */
export function dataAxis(lo: number, hi: number, count = 5, pad = 0.02): Ticks {
  const span = hi - lo || Math.abs(lo) || 1;
  const min = lo - span * pad;
  const max = hi + span * pad;
  const t = ticksOver(min, max, count);
  return { min, max, step: t.step, values: t.values.filter((v) => v >= min && v <= max) };
}

export type SignedAxis = Ticks & {
  /** "positive": every value ≥ 0, the axis starts at 0; "negative": every value ≤ 0, it ends at 0. */
  half: 'positive' | 'negative' | null;
};

/**
 * The axis of signed values such as rank correlations, within [−limit, limit]: a half axis from 0
 * when every value pushes the same way, else symmetric about 0 so that both directions compare.
 */
export function signedAxis(values: number[], limit = 1, count = 4): SignedAxis {
  const largest = Math.min(limit, Math.max(0, ...values.map(Math.abs))) || limit / 10;
  const t = ticksOver(0, largest, count);
  const kept = t.values.filter((v) => v <= limit + 1e-12);
  const max = kept[kept.length - 1] < largest ? limit : kept[kept.length - 1];
  const up = kept[kept.length - 1] < max ? [...kept, max] : kept;
  const down = up.map((v) => (v === 0 ? 0 : -v)).reverse();
  if (values.every((v) => v >= 0)) return { min: 0, max, step: t.step, values: up, half: 'positive' };
  if (values.every((v) => v <= 0)) return { min: -max, max: 0, step: t.step, values: down, half: 'negative' };
  return { min: -max, max, step: t.step, values: [...down.slice(0, -1), ...up], half: null };
}

/** Where a value lies against a plotted range: inside it, or off one end. */
export function placement(value: number, range: { min: number; max: number }): 'inside' | 'below' | 'above' {
  return value < range.min ? 'below' : value > range.max ? 'above' : 'inside';
}

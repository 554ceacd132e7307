/**
 * The percentiles a run reports, and their order: the engine's own list (P5 … P95), so the
 * outcome table, the S-curves and the brief read the keys the engine wrote and no other.
 * The list lives in the engine because the engine computes them; this module is the one place
 * the app takes them from.
 */
import type { PercentileKey } from '@/lib/sim';
import { PERCENTILES, PERCENTILE_KEYS } from './engine';

export { PERCENTILES, PERCENTILE_KEYS, type PercentileKey };

/** The probability a key stands for (P80 → 0.8). */
export function probabilityOf(key: PercentileKey): number {
  return PERCENTILES.find(([k]) => k === key)![1];
}

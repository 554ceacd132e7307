/**
 * The approved baselines of a project in date order, as the trend chart and its table read
 * them. Contingency is measured at P80 for every baseline (P80 − base), so that the drawdown
 * compares like with like even when runs were started to fund at different levels.
 */
import { contingencyAt } from '@/lib/domain/contingency';
import type { SimulationResult } from '@/lib/sim';

export type BaselineSource = {
  approvalId: number;
  runId: number;
  /** The run's number within its project, the name people read. */
  runNumber: number;
  decidedAt: string;
  stage: string;
  estimateClass: number;
  sponsorName: string;
  result: Pick<SimulationResult, 'cost'>;
};

export type TrendRow = Omit<BaselineSource, 'result'> & {
  base: number;
  p50: number;
  p80: number;
  contingencyP80: number;
  /** Change of the P80 contingency since the previous baseline (null for the first). */
  contingencyChange: number | null;
};

export function trendRows(baselines: BaselineSource[]): TrendRow[] {
  const ordered = [...baselines].sort(
    (a, b) => a.decidedAt.localeCompare(b.decidedAt) || a.approvalId - b.approvalId,
  );
  let previous: number | null = null;
  return ordered.map(({ result, ...source }) => {
    const { base, percentiles } = result.cost;
    const contingencyP80 = contingencyAt(result.cost, 'P80').amount;
    const row: TrendRow = {
      ...source,
      base,
      p50: percentiles.P50,
      p80: percentiles.P80,
      contingencyP80,
      contingencyChange: previous === null ? null : contingencyP80 - previous,
    };
    previous = contingencyP80;
    return row;
  });
}

/**
 * The approved baselines of a project in date order, as the trend charts and their table read
 * them. Contingency is measured at P80 for every baseline (P80 − base), and the schedule margin
 * likewise (duration P80 − base duration, in working days), so that the drawdown compares like
 * with like even when runs were started to fund at different levels.
 *
 * Pre- and post-mitigation baselines are different quantities: a change between the two is the
 * response, not a drawdown. So every row says its scenario, and a row's change is measured
 * from the previous baseline of the same scenario only; the charts draw one line per scenario.
 */
import { contingencyAt } from '@/lib/domain/contingency';
import type { SimulationResult } from '@/lib/sim';
import type { Scenario } from './scenario';

export type BaselineSource = {
  approvalId: number;
  runId: number;
  /** The run's number within its project, the name people read. */
  runNumber: number;
  decidedAt: string;
  stage: string;
  estimateClass: number;
  sponsorName: string;
  /** Approved by the person who started the run. */
  selfApproved?: boolean;
  /** The risk values the run was started with, when the result does not say (version 1). */
  riskValues?: Scenario | null;
  result: Pick<SimulationResult, 'cost'> & Partial<Pick<SimulationResult, 'duration' | 'mitigation'>>;
};

export type TrendRow = Omit<BaselineSource, 'result' | 'riskValues' | 'selfApproved'> & {
  scenario: Scenario;
  selfApproved: boolean;
  base: number;
  p50: number;
  p80: number;
  contingencyP80: number;
  /** Change of the P80 contingency since the previous baseline of the same scenario (null for the first). */
  contingencyChange: number | null;
  /** Duration P80 − base duration in working days; null without a schedule. */
  scheduleMarginP80: number | null;
  scheduleMarginChange: number | null;
};

export function scenarioOf(source: Pick<BaselineSource, 'result' | 'riskValues'>): Scenario {
  return source.result.mitigation?.used ?? source.riskValues ?? 'pre';
}

export function trendRows(baselines: BaselineSource[]): TrendRow[] {
  const ordered = [...baselines].sort(
    (a, b) => a.decidedAt.localeCompare(b.decidedAt) || a.approvalId - b.approvalId,
  );
  const previous = new Map<Scenario, { contingency: number; margin: number | null }>();
  return ordered.map(({ result, riskValues, selfApproved, ...source }) => {
    const scenario = scenarioOf({ result, riskValues });
    const { base, percentiles } = result.cost;
    const contingencyP80 = contingencyAt(result.cost, 'P80').amount;
    const scheduleMarginP80 = result.duration ? contingencyAt(result.duration, 'P80').amount : null;
    const before = previous.get(scenario);
    const row: TrendRow = {
      ...source,
      scenario,
      selfApproved: Boolean(selfApproved),
      base,
      p50: percentiles.P50,
      p80: percentiles.P80,
      contingencyP80,
      contingencyChange: before ? contingencyP80 - before.contingency : null,
      scheduleMarginP80,
      scheduleMarginChange:
        before && before.margin !== null && scheduleMarginP80 !== null
          ? scheduleMarginP80 - before.margin
          : null,
    };
    previous.set(scenario, { contingency: contingencyP80, margin: scheduleMarginP80 });
    return row;
  });
}

/**
 * The risk events of a run's input, ranked by expected cost: probability × mean cost impact.
 *
 *   E[cost of risk i] = p_i · E[impact_i]
 *
 * (the expected value of a Bernoulli(p) occurrence times an independent impact). Read from the
 * run's input snapshot, not the live register, so that the brief matches the run it reports.
 * After the responses (post-mitigation), a risk's post values stand where it has them; a missing
 * one keeps the value before the response, as the engine reads it.
 */
import { createDistribution, type DistSpec, type ModelRisk } from '@/lib/sim';

type WithRisks = { risks?: readonly ModelRisk[] };

export type RiskExposure = {
  id: string;
  name: string;
  probability: number;
  /** Mean cost if the event occurs (0 when it has no cost impact). */
  meanCost: number;
  /** probability × meanCost. */
  expectedCost: number;
  /** Mean delay in working days if it occurs, when it has a delay impact. */
  meanDelay: number | null;
};

function meanOf(spec: DistSpec | undefined, where: string, field: string): number | null {
  if (!spec) return null;
  return createDistribution(spec, { where, field }).mean;
}

/** Every risk of the model with its expected cost, the largest first (ties by id). */
export function riskExposures(model: WithRisks, scenario: 'pre' | 'post' = 'pre'): RiskExposure[] {
  return (model.risks ?? [])
    .map((r) => {
      const after = scenario === 'post' ? r.post : undefined;
      const probability = after?.probability ?? r.probability;
      const meanCost = meanOf(after?.cost ?? r.cost, `risks.${r.id}`, 'cost') ?? 0;
      return {
        id: r.id,
        name: r.name ?? r.id,
        probability,
        meanCost,
        expectedCost: probability * meanCost,
        meanDelay: meanOf(after?.delay ?? r.delay, `risks.${r.id}`, 'delay'),
      };
    })
    .sort((a, b) => b.expectedCost - a.expectedCost || a.id.localeCompare(b.id));
}

export function topRiskExposures(
  model: WithRisks,
  count = 8,
  scenario: 'pre' | 'post' = 'pre',
): RiskExposure[] {
  return riskExposures(model, scenario).slice(0, count);
}

/**
 * Which scenario the brief's figures are, before or after the planned risk responses, and what
 * the responses cost. A version 2 result that carries both scenarios (its `mitigation` block,
 * computed from the same random numbers) gives both sets of figures; otherwise the run was
 * started with one set of risk values and says which.
 *
 * The responses' cost is the expected value of each risk's `mitigationCost` (a number, or the
 * mean of its distribution), summed: the amount the post-mitigation total already includes.
 */
import { createDistribution, type Model, type SimulationResult } from '@/lib/sim';

export type Scenario = 'pre' | 'post';

export type ScenarioFigures = {
  costP50: number;
  costP80: number;
  durationP50: number | null;
  durationP80: number | null;
};

export type ScenarioBrief = {
  used: Scenario;
  /** Both scenarios of the same run, when the result carries them. */
  compared: { pre: ScenarioFigures; post: ScenarioFigures } | null;
  /** The responses that carry a cost: how many, and their expected cost in total. */
  responses: { count: number; expectedCost: number } | null;
};

function figures(s: NonNullable<SimulationResult['mitigation']>['pre']): ScenarioFigures {
  return {
    costP50: s.cost.percentiles.P50,
    costP80: s.cost.percentiles.P80,
    durationP50: s.duration?.percentiles.P50 ?? null,
    durationP80: s.duration?.percentiles.P80 ?? null,
  };
}

/** Expected cost of the responses in the model (risks with a `mitigationCost`). */
export function responseCost(model: Pick<Model, 'risks'>): ScenarioBrief['responses'] {
  let count = 0;
  let expectedCost = 0;
  for (const r of model.risks ?? []) {
    const spec = r.mitigationCost;
    if (spec === undefined) continue;
    const mean =
      typeof spec === 'number'
        ? spec
        : createDistribution(spec, { where: `risks.${r.id}`, field: 'mitigationCost' }).mean;
    count += 1;
    expectedCost += mean;
  }
  return count ? { count, expectedCost } : null;
}

export function scenarioBrief(
  result: Pick<SimulationResult, 'mitigation'>,
  model: Pick<Model, 'risks'>,
  startedWith: Scenario,
): ScenarioBrief {
  const m = result.mitigation;
  return {
    used: m?.used ?? startedWith,
    compared: m ? { pre: figures(m.pre), post: figures(m.post) } : null,
    responses: responseCost(model),
  };
}

// The zod schema of the model file (versions 1 and 2), shared by the command line and the app's import.
// Field rules live here; the rules of each distribution's parameters come from the distribution
// factories themselves (one source of truth), and the cross-entry rules from ./model-checks.
// Messages name the entry: `items[3] (C4).dist.mode: must lie between low and high (…)`.

import { z } from 'zod';
import { createDistribution } from './distributions';
import { InputError } from './errors';
import { checkModel } from './model-checks';
import type { DistSpec, Model } from './formats';

// Magnitude bounds: beyond them the sums of a run lose every digit or overflow to Infinity.
// Amounts lie within ±1e13, durations and delays within 1e5 working days.
export const MAX_MAGNITUDE = 1e13;
export const MAX_DAYS = 1e5;
const num = z.number().min(-MAX_MAGNITUDE).max(MAX_MAGNITUDE);
const threePoint = {
  low: num,
  mode: num,
  high: num,
  range: z.enum(['min-max', 'p10-p90']).optional(),
};

const lognormalPairComplete = (d: { p10?: number; p90?: number; mean?: number; sd?: number }) =>
  (d.p10 !== undefined && d.p90 !== undefined && d.mean === undefined && d.sd === undefined) ||
  (d.mean !== undefined && d.sd !== undefined && d.p10 === undefined && d.p90 === undefined);

const lognormalSchema = z
  .strictObject({
    type: z.literal('lognormal'),
    p10: num.optional(),
    p90: num.optional(),
    mean: num.optional(),
    sd: num.optional(),
  })
  .superRefine((d, ctx) => {
    const byPercentiles = d.p10 !== undefined || d.p90 !== undefined;
    const byMoments = d.mean !== undefined || d.sd !== undefined;
    if (byPercentiles === byMoments) {
      ctx.addIssue({ code: 'custom', message: 'give either p10 and p90, or mean and sd', path: [] });
      return;
    }
    for (const f of byPercentiles ? (['p10', 'p90'] as const) : (['mean', 'sd'] as const)) {
      if (d[f] === undefined) ctx.addIssue({ code: 'custom', message: 'is required', path: [f] });
    }
  });

export const distSchema = z
  .discriminatedUnion('type', [
    z.strictObject({ type: z.literal('fixed'), value: num }),
    z.strictObject({ type: z.literal('uniform'), low: num, high: num }),
    z.strictObject({ type: z.literal('triangular'), ...threePoint }),
    z.strictObject({ type: z.literal('pert'), ...threePoint }),
    z.strictObject({ type: z.literal('normal'), mean: num, sd: num }),
    lognormalSchema,
  ])
  .superRefine((spec, ctx) => {
    // The factories validate parameters (low < high, sd > 0, …) and say which field is wrong.
    if (spec.type === 'lognormal' && !lognormalPairComplete(spec)) return;
    try {
      createDistribution(spec as DistSpec, { where: '', field: '' });
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      ctx.addIssue({ code: 'custom', message: e.problem, path: e.field ? e.field.split('.') : [] });
    }
  });

const id = z.string().min(1);
const probability = num.min(0).max(1);
const numberOrDist = z.union([num, distSchema]);

/** A distribution of working days: every parameter within MAX_DAYS. */
const daysSchema = distSchema.superRefine((spec, ctx) => {
  for (const [field, value] of Object.entries(spec)) {
    if (typeof value === 'number' && Math.abs(value) > MAX_DAYS)
      ctx.addIssue({
        code: 'custom',
        message: `must be within ±${MAX_DAYS} days (got ${value})`,
        path: [field],
      });
  }
});

const itemSchema = z.strictObject({
  id,
  name: z.string().optional(),
  base: num.optional(),
  dist: distSchema.optional(),
  ratePerDay: numberOrDist.optional(),
  activity: id.optional(),
  span: z.literal('project').optional(),
});

const riskPostSchema = z.strictObject({
  probability: probability.optional(),
  cost: distSchema.optional(),
  delay: distSchema.optional(),
});

const riskSchema = z.strictObject({
  id,
  name: z.string().optional(),
  probability,
  cost: distSchema.optional(),
  delay: daysSchema.optional(),
  activity: id.optional(),
  activities: z.array(id).optional(),
  items: z.array(id).optional(),
  sizes: z.enum(['linked', 'independent']).optional(),
  post: riskPostSchema.optional(),
  mitigationCost: numberOrDist.optional(),
});

const driverSchema = z.strictObject({
  id,
  name: z.string().optional(),
  probability: probability.optional(),
  factor: distSchema,
  applies: z.array(id).min(1),
});

const predecessorSchema = z.union([
  id,
  z.strictObject({
    id,
    type: z.enum(['FS', 'SS', 'FF', 'SF']).optional(),
    lag: num.min(-MAX_DAYS).max(MAX_DAYS).optional(),
  }),
]);

const activitySchema = z.strictObject({
  id,
  name: z.string().optional(),
  duration: daysSchema,
  predecessors: z.array(predecessorSchema).optional(),
  existence: probability.optional(),
});

const correlationSchema = z.strictObject({ a: id, b: id, rho: num.min(-1).max(1) });

export const settingsSchema = z.strictObject({
  iterations: z.int().min(1).max(10_000_000).optional(),
  seed: z.union([z.int(), z.string().min(1)]).optional(),
  sampling: z.enum(['mc', 'lhs']).optional(),
  mitigation: z.enum(['pre', 'post']).optional(),
  jointConfidence: num.gt(0).lt(1).optional(),
  contingencyLevel: z.enum(['P50', 'P70', 'P80', 'P90']).optional(),
});

export const modelSchema = z
  .strictObject({
    format: z.literal('outturn-model'),
    version: z.literal([1, 2]),
    name: z.string().optional(),
    currency: z.string().optional(),
    // What the project says of itself; the engine reads none of it.
    project: z
      .strictObject({
        stage: z.string().max(60).optional(),
        estimateClass: z.number().int().min(1).max(5).optional(),
        baseDate: z.iso.date({ message: 'Write the base date as YYYY-MM-DD.' }).optional(),
      })
      .optional(),
    items: z.array(itemSchema),
    risks: z.array(riskSchema).optional(),
    activities: z.array(activitySchema).optional(),
    correlations: z.array(correlationSchema).optional(),
    drivers: z.array(driverSchema).optional(),
    targets: z.strictObject({ cost: num.optional(), duration: num.min(0).optional() }).optional(),
    settings: settingsSchema.optional(),
  })
  .superRefine((model, ctx) => {
    for (const p of checkModel(model as Model))
      ctx.addIssue({ code: 'custom', message: p.message, path: p.path });
  });

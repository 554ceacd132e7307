import { z } from 'zod';

export const CONFIDENCE_LEVELS = ['P50', 'P70', 'P80', 'P90'] as const;
export type ConfidenceLevel = (typeof CONFIDENCE_LEVELS)[number];
export const SAMPLINGS = ['lhs', 'mc'] as const;
export const RISK_VALUES = ['pre', 'post'] as const;

export const MIN_ITERATIONS = 1_000;
/** Runs above 1,000,000 iterations run in bounded memory (the engine's BOUNDED_FROM). */
export const MAX_ITERATIONS = 10_000_000;
/** A run to a precision goal keeps every iteration in memory: its cap stays at 1,000,000. */
export const MAX_PRECISION_ITERATIONS = 1_000_000;
export const DEFAULT_ITERATIONS = 10_000;
/** Seeds are positive 31-bit integers: easy to read aloud, to type and to store. */
export const MAX_SEED = 2_147_483_646;

/** Empty form fields (blank text, NaN from a number input, null) mean "not given". */
const blankToUndefined = (v: unknown) =>
  v === '' || v === null || (typeof v === 'number' && Number.isNaN(v)) ? undefined : v;

const iterationsMessage = `Enter a whole number of iterations from ${MIN_ITERATIONS.toLocaleString('en')} to ${MAX_ITERATIONS.toLocaleString('en')}.`;
const iterations = z
  .number({ message: iterationsMessage })
  .int({ message: iterationsMessage })
  .min(MIN_ITERATIONS, { message: iterationsMessage })
  .max(MAX_ITERATIONS, { message: iterationsMessage });

const precisionIterationsMessage = `Enter a whole number of iterations from ${MIN_ITERATIONS.toLocaleString('en')} to ${MAX_PRECISION_ITERATIONS.toLocaleString('en')} for a run to a precision goal.`;
const precisionIterations = z
  .number({ message: precisionIterationsMessage })
  .int({ message: precisionIterationsMessage })
  .min(MIN_ITERATIONS, { message: precisionIterationsMessage })
  .max(MAX_PRECISION_ITERATIONS, { message: precisionIterationsMessage });

const seedMessage = `The seed is a whole number from 1 to ${MAX_SEED.toLocaleString('en')}.`;

export const precisionSchema = z.object({
  relativePercent: z
    .number({ message: 'Enter the wanted precision of P80 in percent, from 0.1 to 10.' })
    .min(0.1, { message: 'The precision must be at least ±0.1 %.' })
    .max(10, { message: 'The precision must be at most ±10 %.' }),
  maxIterations: precisionIterations,
});

/** What a person (or a script) sends to start a run. */
export const runSettingsInputSchema = z
  .object({
    iterations: iterations.default(DEFAULT_ITERATIONS),
    seed: z.preprocess(
      blankToUndefined,
      z
        .number({ message: seedMessage })
        .int({ message: seedMessage })
        .min(1, { message: seedMessage })
        .max(MAX_SEED, { message: seedMessage })
        .optional(),
    ),
    sampling: z
      .enum(SAMPLINGS, { message: 'Sampling is "lhs" (Latin hypercube) or "mc" (plain Monte Carlo).' })
      .default('lhs'),
    riskValues: z
      .enum(RISK_VALUES, { message: 'Risk values are "pre" or "post" mitigation.' })
      .default('pre'),
    costTarget: z.preprocess(
      blankToUndefined,
      z
        .number({ message: 'Enter the cost target as an amount greater than 0.' })
        .positive({ message: 'Enter the cost target as an amount greater than 0.' })
        .optional(),
    ),
    finishTarget: z.preprocess(
      blankToUndefined,
      z.iso.date({ message: 'Enter the finish target as a date, YYYY-MM-DD.' }).optional(),
    ),
    confidence: z.enum(CONFIDENCE_LEVELS, { message: 'Choose P50, P70, P80 or P90.' }).default('P80'),
    precision: precisionSchema.nullable().optional(),
  })
  .superRefine((s, ctx) => {
    if (s.precision && s.iterations > MAX_PRECISION_ITERATIONS) {
      ctx.addIssue({ code: 'custom', path: ['iterations'], message: precisionIterationsMessage });
    }
    if (s.precision && s.precision.maxIterations < s.iterations) {
      ctx.addIssue({
        code: 'custom',
        path: ['precision', 'maxIterations'],
        message: 'The cap must be at least the first round of iterations.',
      });
    }
  });
export type RunSettingsInput = z.input<typeof runSettingsInputSchema>;

/** The settings stored with a run: everything resolved, the seed always present. */
export type RunSettings = {
  iterations: number;
  seed: number;
  sampling: (typeof SAMPLINGS)[number];
  riskValues: (typeof RISK_VALUES)[number];
  confidence: ConfidenceLevel;
  costTarget: number | null;
  finishTarget: string | null;
  /** The finish target in working days from the project's base date (what the engine reads). */
  durationTarget: number | null;
  precision: { relativePercent: number; maxIterations: number } | null;
  /** The organisation's calendar when the run started; runs stored before calendars have none (Monday to Friday). */
  calendar?: { weekdays: number[]; holidays: string[] };
};

/** The settings form: every field present, as the inputs hold them. */
export const runSettingsFormSchema = z
  .object({
    mode: z.enum(['fixed', 'precision']),
    iterations,
    seed: z
      .number({ message: seedMessage })
      .int({ message: seedMessage })
      .min(1, { message: seedMessage })
      .max(MAX_SEED, { message: seedMessage }),
    sampling: z.enum(SAMPLINGS),
    riskValues: z.enum(RISK_VALUES),
    costTarget: z.string().refine((v) => v.trim() === '' || Number(v.replace(/[\s,]/g, '')) > 0, {
      message: 'Enter the cost target as an amount greater than 0, or leave it blank.',
    }),
    finishTarget: z.string().refine((v) => v === '' || /^\d{4}-\d{2}-\d{2}$/.test(v), {
      message: 'Enter the finish target as a date, or leave it blank.',
    }),
    confidence: z.enum(CONFIDENCE_LEVELS),
    relativePercent: z
      .number({ message: 'Enter the wanted precision in percent.' })
      .min(0.1, { message: 'The precision must be at least ±0.1 %.' })
      .max(10, { message: 'The precision must be at most ±10 %.' }),
    maxIterations: iterations,
  })
  .superRefine((s, ctx) => {
    if (s.mode === 'precision') {
      for (const path of ['iterations', 'maxIterations'] as const)
        if (s[path] > MAX_PRECISION_ITERATIONS)
          ctx.addIssue({ code: 'custom', path: [path], message: precisionIterationsMessage });
    }
    if (s.mode === 'precision' && s.maxIterations < s.iterations) {
      ctx.addIssue({
        code: 'custom',
        path: ['maxIterations'],
        message: 'The cap must be at least the first round of iterations.',
      });
    }
  });
export type RunSettingsForm = z.infer<typeof runSettingsFormSchema>;

/** The form's values as the API's input. */
export function formToInput(form: RunSettingsForm): RunSettingsInput {
  const cost = form.costTarget.trim() === '' ? undefined : Number(form.costTarget.replace(/[\s,]/g, ''));
  return {
    iterations: form.iterations,
    seed: form.seed,
    sampling: form.sampling,
    riskValues: form.riskValues,
    costTarget: cost,
    finishTarget: form.finishTarget || undefined,
    confidence: form.confidence,
    precision:
      form.mode === 'precision'
        ? { relativePercent: form.relativePercent, maxIterations: form.maxIterations }
        : null,
  };
}

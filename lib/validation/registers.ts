// The rows of the registers, one zod schema each, shared by the grids (checking a cell as
// it is typed) and the route handlers (checking what is saved). Distribution parameters are
// checked by the engine's own factories (lib/registers/dist-fields.ts).

import { z } from 'zod';
import {
  DIST_TYPES,
  RANGE_KINDS,
  specFromParts,
  type DistParts,
  type DistType,
} from '@/lib/registers/dist-fields';
import {
  anyPostCell,
  IMPACT_CELLS,
  impactCell,
  impactParts,
  MITIGATION_TYPES,
  mitigationCell,
  mitigationParts,
  readCodeList,
  RISK_IMPACT_TYPES,
  RISK_SIZES,
  type ImpactPrefix,
} from '@/lib/registers/risk-fields';
import type { FieldIssue } from '@/lib/errors';
import { splitApplies } from '@/lib/registers/driver-applies';
import { FACTOR_ENTRIES, factorBelowZero, readFactor } from '@/lib/registers/driver-factor';

export const REGISTER_KINDS = ['items', 'risks', 'activities', 'correlations', 'drivers'] as const;
export type RegisterKind = (typeof REGISTER_KINDS)[number];

export const RISK_STATUSES = ['open', 'mitigating', 'closed', 'occurred'] as const;
export const RISK_RESPONSES = ['avoid', 'reduce', 'transfer', 'accept'] as const;
export const BASES = ['lump-sum', 'per-day', 'per-project-day'] as const;

const describe = (input: unknown) => (typeof input === 'string' ? `"${input}"` : String(input));

/**
 * The largest magnitudes a row may hold. Beyond them sums of thousands of samples lose every
 * digit or overflow to Infinity, and no capital project needs them: ten trillion in any
 * currency, and a hundred thousand working days (some four centuries).
 */
export const MAX_MONEY = 1e13;
export const MAX_DAYS = 1e5;
export type Bound = { max: number; text: string };
export const MONEY: Bound = { max: MAX_MONEY, text: `±${MAX_MONEY.toLocaleString('en-GB')}` };
export const DAYS: Bound = { max: MAX_DAYS, text: `±${MAX_DAYS.toLocaleString('en-GB')} days` };

/** The schema, or null when the cell is empty (absent, null). */
const orNull = <T extends z.ZodType>(schema: T) =>
  schema
    .nullable()
    .optional()
    .transform((v) => v ?? null);

/** Required text of at most `max` characters, named `field` in the messages. */
const requiredText = (field: string, max: number) =>
  z
    .string({ error: `Enter a ${field}.` })
    .trim()
    .min(1, { message: `Enter a ${field}.` })
    .max(max, { message: `Keep the ${field} under ${max} characters.` });

/** An optional number within ±bound: empty is null; text that is not a number says so. */
const optNumber = (label: string, bound: Bound) =>
  orNull(
    z
      .number({ error: (iss) => `${label} must be a number (got ${describe(iss.input)}).` })
      .refine(Number.isFinite, { message: `${label} must be a finite number.` })
      .refine((v) => Math.abs(v) <= bound.max, {
        error: (iss) => `${label} must lie within ${bound.text} (got ${describe(iss.input)}).`,
      }),
  );

const optText = (max: number, label: string) =>
  z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, { message: `Keep ${label.toLowerCase()} under ${max} characters.` })
    .nullable()
    .optional()
    .transform((v) => (v ? v : null));

export const codeSchema = requiredText('code', 40).regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]*$/, {
  message: 'Use letters, digits, dots, dashes or slashes (no spaces, commas or +).',
});

const probability = (label: string) =>
  z
    .number({ error: (iss) => `${label} must be a number between 0% and 100% (got ${describe(iss.input)}).` })
    .min(0, { message: `${label} cannot be below 0%.` })
    .max(1, { message: `${label} cannot be above 100%.` });

type Ctx = z.core.$RefinementCtx;

/** Checks the flat distribution cells `prefix + Low…` and reports on those cells. */
function refineDist(
  ctx: Ctx,
  type: DistType,
  cells: Omit<DistParts, 'type'>,
  field: (part: string) => string,
  extra?: (cells: Omit<DistParts, 'type'>) => void,
) {
  const result = specFromParts({ ...cells, type });
  if (!result.ok) {
    for (const issue of result.issues)
      ctx.addIssue({ code: 'custom', path: [field(issue.part)], message: issue.message });
    return;
  }
  extra?.(cells);
}

// ---- Line items ----

const lineItemShape = {
  code: codeSchema,
  description: requiredText('description', 255),
  basis: z
    .enum(BASES, { message: 'Choose lump sum, per day (of an activity) or per project day.' })
    .default('lump-sum'),
  activityCode: optText(40, 'Activity'),
  distType: z.enum(DIST_TYPES, { message: `Choose a distribution: ${DIST_TYPES.join(', ')}.` }).nullable(),
  range: orNull(z.enum(RANGE_KINDS, { message: 'Range is min-max or p10-p90.' })),
  low: optNumber('Low', MONEY),
  mode: optNumber('Most likely', MONEY),
  high: optNumber('High', MONEY),
  mean: optNumber('Mean', MONEY),
  sd: optNumber('SD', MONEY),
  base: optNumber('Base', MONEY),
  ownerName: optText(120, 'Owner'),
  notes: optText(4000, 'Notes'),
};

type LineItemShape = z.infer<z.ZodObject<typeof lineItemShape>>;

function refineLineItem(row: LineItemShape, ctx: Ctx) {
  if (row.basis === 'per-day') {
    if (!row.activityCode)
      ctx.addIssue({ code: 'custom', path: ['activityCode'], message: 'A per-day line needs its activity.' });
  } else if (row.activityCode) {
    ctx.addIssue({
      code: 'custom',
      path: ['activityCode'],
      message:
        row.basis === 'per-project-day'
          ? 'A per-project-day line runs with the whole project; clear its activity.'
          : 'Only per-day lines take an activity; clear it or set the basis to per day.',
    });
  }
  if (row.basis !== 'lump-sum' && !row.distType)
    ctx.addIssue({
      code: 'custom',
      path: ['distType'],
      message: 'Choose the distribution of the rate per day (Fixed for a set rate).',
    });
  if (!row.distType) {
    if (row.base === null)
      ctx.addIssue({
        code: 'custom',
        path: ['base'],
        message: 'Enter a base amount, or choose a distribution.',
      });
    return;
  }
  refineDist(ctx, row.distType, row, (p) => (p === 'type' ? 'distType' : p));
}

export const lineItemSchema = z.object(lineItemShape).superRefine(refineLineItem);
export type LineItemInput = z.input<typeof lineItemSchema>;
export type LineItemData = z.output<typeof lineItemSchema>;

// ---- Risk events ----

const impactType = (label: string) =>
  orNull(
    z.enum(RISK_IMPACT_TYPES, {
      message: `${label}: choose ${RISK_IMPACT_TYPES.join(', ')}.`,
    }),
  );

/** A list of codes (the grid's multi-pick, a file's "A-10, A-20"); empty is an empty list. */
const codeList = (label: string) =>
  z.preprocess(
    (v) => (v === null || v === undefined || v === '' ? [] : typeof v === 'string' ? readCodeList(v) : v),
    z
      .array(codeSchema, { error: `${label} must be a list of codes.` })
      .max(200, { message: `${label}: at most 200 codes.` }),
  );

/** The five cells of one impact (low, most likely, high, mean, sd), bounded by `bound`. */
const impactCells = (prefix: ImpactPrefix, label: string, bound: Bound) => ({
  [`${prefix}Low`]: optNumber(`${label} low`, bound),
  [`${prefix}Mode`]: optNumber(`${label} most likely`, bound),
  [`${prefix}High`]: optNumber(`${label} high`, bound),
  [`${prefix}Mean`]: optNumber(`${label} mean`, bound),
  [`${prefix}Sd`]: optNumber(`${label} SD`, bound),
});

const riskShape = {
  code: codeSchema,
  title: requiredText('title', 255),
  cause: optText(4000, 'Cause'),
  event: optText(4000, 'Event'),
  effect: optText(4000, 'Effect'),
  ownerName: optText(120, 'Owner'),
  status: z.enum(RISK_STATUSES, { message: `Status is one of ${RISK_STATUSES.join(', ')}.` }).default('open'),
  response: z
    .enum(RISK_RESPONSES, { message: `Response is one of ${RISK_RESPONSES.join(', ')}.` })
    .default('reduce'),
  probability: probability('Probability'),
  costType: impactType('Cost impact'),
  ...(impactCells('cost', 'Cost', MONEY) as Record<`cost${ImpactCell}`, NumberCell>),
  delayType: impactType('Delay'),
  ...(impactCells('delay', 'Delay', DAYS) as Record<`delay${ImpactCell}`, NumberCell>),
  activityCodes: codeList('Activities').default([]),
  itemCodes: codeList('Cost lines').default([]),
  sizes: z
    .enum(RISK_SIZES, { message: 'Sizes are linked (one draw sizes cost and delay) or independent.' })
    .default('linked'),
  mitigationType: orNull(
    z.enum(MITIGATION_TYPES, { message: `Mitigation cost: choose ${MITIGATION_TYPES.join(', ')}.` }),
  ),
  mitigationLow: optNumber('Mitigation cost low', MONEY),
  mitigationCost: optNumber('Mitigation cost', MONEY),
  mitigationHigh: optNumber('Mitigation cost high', MONEY),
  postProbability: orNull(probability('Post-mitigation probability')),
  ...(impactCells('postCost', 'Post cost', MONEY) as Record<`postCost${ImpactCell}`, NumberCell>),
  ...(impactCells('postDelay', 'Post delay', DAYS) as Record<`postDelay${ImpactCell}`, NumberCell>),
};

type ImpactCell = (typeof IMPACT_CELLS)[number];
type NumberCell = ReturnType<typeof optNumber>;
type RiskShape = z.infer<z.ZodObject<typeof riskShape>>;
export type { ImpactPrefix };
export { impactParts, RISK_IMPACT_TYPES, RISK_SIZES, MITIGATION_TYPES };

function refineImpacts(row: RiskShape, ctx: Ctx) {
  for (const prefix of ['cost', 'delay', 'postCost', 'postDelay'] as const) {
    const parts = impactParts(row, prefix);
    const post = prefix === 'postCost' || prefix === 'postDelay';
    const what = prefix === 'postCost' ? 'cost' : 'delay';
    if (!parts) {
      if (post && anyPostCell(row, prefix)) {
        ctx.addIssue({
          code: 'custom',
          path: [`${prefix}Mode`],
          message: `Post-mitigation ${what} needs a ${what} type before it.`,
        });
      }
      continue;
    }
    if (post && !anyPostCell(row, prefix)) continue;
    refineDist(ctx, parts.type, parts, (p) => impactCell(prefix, p));
  }
}

function refineMitigation(row: RiskShape, ctx: Ctx) {
  const parts = mitigationParts(row);
  if (!parts) {
    if (row.mitigationLow !== null || row.mitigationHigh !== null)
      ctx.addIssue({
        code: 'custom',
        path: ['mitigationType'],
        message: 'Choose how the mitigation cost is given (fixed or a range).',
      });
    return;
  }
  refineDist(ctx, parts.type, parts, mitigationCell, (c) => {
    for (const part of ['low', 'mode', 'high'] as const) {
      if ((c[part] ?? 0) < 0)
        ctx.addIssue({
          code: 'custom',
          path: [mitigationCell(part)],
          message: 'Mitigation cost cannot be negative.',
        });
    }
  });
}

function refineRisk(row: RiskShape, ctx: Ctx) {
  if (!row.costType && !row.delayType) {
    ctx.addIssue({
      code: 'custom',
      path: ['costType'],
      message: 'A risk needs a cost impact, a delay, or both.',
    });
  }
  refineImpacts(row, ctx);
  refineMitigation(row, ctx);
  if (row.delayType && row.activityCodes.length === 0) {
    ctx.addIssue({
      code: 'custom',
      path: ['activityCodes'],
      message: 'A delay needs the activities it lengthens.',
    });
  }
  for (const field of ['activityCodes', 'itemCodes'] as const) {
    const twice = row[field].find((code, i) => row[field].indexOf(code) !== i);
    if (twice) ctx.addIssue({ code: 'custom', path: [field], message: `${twice} is listed twice.` });
  }
  if (row.itemCodes.length && !row.costType) {
    ctx.addIssue({
      code: 'custom',
      path: ['itemCodes'],
      message: 'Only a risk with a cost impact belongs to cost lines; clear them or add a cost.',
    });
  }
}

export const riskSchema = z.object(riskShape).superRefine(refineRisk);
export type RiskInput = z.input<typeof riskSchema>;
export type RiskData = z.output<typeof riskSchema>;

// ---- Activities ----

export const predecessorLinkSchema = z.object({
  code: codeSchema,
  type: z.enum(['FS', 'SS', 'FF', 'SF'], { message: 'A link type is FS, SS, FF or SF.' }).optional(),
  lag: z
    .number({ error: 'A lag must be a number of working days.' })
    .finite()
    .refine((v) => Math.abs(v) <= MAX_DAYS, { message: `A lag must lie within ${DAYS.text}.` })
    .default(0),
});

const activityShape = {
  code: codeSchema,
  name: requiredText('name', 255),
  distType: z.enum(DIST_TYPES, { message: `Choose a distribution: ${DIST_TYPES.join(', ')}.` }),
  range: lineItemShape.range,
  low: optNumber('Low', DAYS),
  mode: optNumber('Most likely', DAYS),
  high: optNumber('High', DAYS),
  mean: optNumber('Mean', DAYS),
  sd: optNumber('SD', DAYS),
  predecessors: z
    .array(predecessorLinkSchema, { error: 'Predecessors must be a list.' })
    .max(100)
    .default([]),
  /** A probabilistic branch: the probability that the activity happens; empty: it always does. */
  existence: orNull(probability('Existence')),
};

type ActivityShape = z.infer<z.ZodObject<typeof activityShape>>;

function refineActivity(row: ActivityShape, ctx: Ctx) {
  refineDist(
    ctx,
    row.distType,
    row,
    (p) => (p === 'type' ? 'distType' : p),
    (c) => {
      if ([c.low, c.mode, c.mean].some((v) => v !== null && v !== undefined && v < 0)) {
        ctx.addIssue({
          code: 'custom',
          path: [c.low != null ? 'low' : 'mean'],
          message: 'A duration cannot be negative.',
        });
      }
    },
  );
  const seen = new Set<string>();
  for (const p of row.predecessors) {
    if (p.code === row.code)
      ctx.addIssue({ code: 'custom', path: ['predecessors'], message: `${row.code} cannot precede itself.` });
    const key = `${p.code} ${p.type ?? 'FS'}`;
    if (seen.has(key))
      ctx.addIssue({ code: 'custom', path: ['predecessors'], message: `${p.code} is listed twice.` });
    seen.add(key);
  }
}

export const activitySchema = z.object(activityShape).superRefine(refineActivity);
export type ActivityInput = z.input<typeof activitySchema>;
export type ActivityData = z.output<typeof activitySchema>;

// ---- Correlations ----

/** A correlated input: a code, or a branch's existence, "A5 (existence)". */
const inputCodeSchema = requiredText('code', 40).regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]*( \(existence\))?$/, {
  message: 'Use an input\'s code, or a branch\'s code followed by " (existence)".',
});

const correlationShape = {
  aCode: inputCodeSchema,
  bCode: inputCodeSchema,
  rho: z
    .number({
      error: (iss) => `The coefficient must be a number between −1 and 1 (got ${describe(iss.input)}).`,
    })
    .min(-1, { message: 'The coefficient cannot be below −1.' })
    .max(1, { message: 'The coefficient cannot be above 1.' }),
};

export const correlationSchema = z.object(correlationShape).superRefine((row, ctx) => {
  if (row.aCode === row.bCode)
    ctx.addIssue({ code: 'custom', path: ['bCode'], message: 'Pick two different inputs.' });
});
export type CorrelationInput = z.input<typeof correlationSchema>;
export type CorrelationData = z.output<typeof correlationSchema>;

// ---- Risk drivers ----

export const DRIVER_FACTOR_TYPES = ['fixed', 'uniform', 'triangular', 'pert', 'lognormal'] as const;
/** The most a factor may say: ten times the sampled value is far past any market or ground. */
export const MAX_FACTOR = 10;

/** A factor cell: a number, or text such as "0.95" or "−5%" (files and pasted cells). */
const factorCell = (label: string) =>
  z.preprocess(
    (v) => readFactor(v, 'factor'),
    z
      .number({
        error: (iss) =>
          `${label} must be a factor such as 0.95 or a change such as −5% (got ${describe(iss.input)}).`,
      })
      .refine(Number.isFinite, { message: `${label} must be a finite number.` })
      .refine((v) => v <= MAX_FACTOR, { message: `${label} cannot be above a factor of ${MAX_FACTOR}.` })
      .nullable()
      .optional()
      .transform((v) => v ?? null),
  );

const appliesSchema = z.preprocess(
  splitApplies,
  z
    .array(z.string().max(60, { message: 'Keep each code or branch under 60 characters.' }))
    .min(1, {
      message: 'Say what the driver applies to: line item or activity codes, or a WBS branch such as 3.*.',
    })
    .max(500, { message: 'List at most 500 codes or branches; use a branch such as 3.* for many lines.' }),
);

const driverShape = {
  code: codeSchema,
  name: requiredText('name', 255),
  standsFor: optText(4000, 'What it stands for'),
  probability: probability('Probability')
    .nullable()
    .optional()
    .transform((v) => v ?? 1),
  distType: z
    .enum(DRIVER_FACTOR_TYPES, { message: `Choose a distribution: ${DRIVER_FACTOR_TYPES.join(', ')}.` })
    .default('triangular'),
  range: lineItemShape.range,
  entry: z
    .enum(FACTOR_ENTRIES, { message: 'Entered as is "change" (percent) or "factor".' })
    .default('change'),
  low: factorCell('Low'),
  mode: factorCell('Most likely'),
  high: factorCell('High'),
  applies: appliesSchema,
};

type DriverShape = z.infer<z.ZodObject<typeof driverShape>>;

function refineDriver(row: DriverShape, ctx: Ctx) {
  const result = specFromParts({ ...row, type: row.distType });
  if (!result.ok) {
    for (const issue of result.issues)
      ctx.addIssue({
        code: 'custom',
        path: [issue.part === 'type' ? 'distType' : issue.part],
        message: issue.message,
      });
    return;
  }
  const below = factorBelowZero(result.spec);
  if (below) ctx.addIssue({ code: 'custom', path: ['low'], message: below });
  const seen = new Set<string>();
  for (const token of row.applies) {
    if (seen.has(token))
      ctx.addIssue({ code: 'custom', path: ['applies'], message: `${token} is listed twice.` });
    seen.add(token);
  }
}

export const driverSchema = z.object(driverShape).superRefine(refineDriver);
export type DriverInput = z.input<typeof driverSchema>;
export type DriverData = z.output<typeof driverSchema>;

export const ROW_SCHEMAS = {
  items: lineItemSchema,
  risks: riskSchema,
  activities: activitySchema,
  correlations: correlationSchema,
  drivers: driverSchema,
} as const;

export type RegisterData = {
  items: LineItemData;
  risks: RiskData;
  activities: ActivityData;
  correlations: CorrelationData;
  drivers: DriverData;
};

// ---- Saving ----

/** A saved row as the API returns it: its data plus id, version and place. */
export type Saved<T> = T & { id: number; version: number; sortOrder: number };

const rowMeta = z.object({
  id: z.number().int().positive().optional(),
  version: z.number().int().positive().optional(),
  /** The client's key for a new row, echoed back with its id. */
  key: z.string().max(64).optional(),
});

export const batchSchema = z.object({
  upserts: z
    .array(z.record(z.string(), z.unknown()), { error: 'upserts must be a list of rows.' })
    .max(20_000)
    .default([]),
  deletes: z
    .array(z.object({ id: z.number().int().positive(), version: z.number().int().positive() }), {
      error: 'deletes must be a list of { id, version }.',
    })
    .max(20_000)
    .default([]),
  /** The whole register's new order, by id or new-row key. */
  order: z
    .array(z.union([z.number().int().positive(), z.string().max(64)]))
    .max(20_000)
    .optional(),
});
export type BatchInput = z.input<typeof batchSchema>;

export type RowMeta = z.infer<typeof rowMeta>;

/** Issues of one row keyed by field, for the grid (first message per field). */
export function rowIssues(kind: RegisterKind, row: unknown): Record<string, string> {
  const parsed = ROW_SCHEMAS[kind].safeParse(row);
  if (parsed.success) return {};
  const out: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const field = String(issue.path[0] ?? '_row');
    out[field] ??= issue.message;
  }
  return out;
}

/**
 * Parses many rows; every issue names the row (1-based, by `label`) and its field, e.g.
 * path "rows[3].mode", message "Row 4 (2.1.3), mode: The most likely must lie between …".
 */
export function parseRows<K extends RegisterKind>(
  kind: K,
  rows: unknown[],
  label: (index: number, row: unknown) => string = (i, r) => {
    const code = (r as { code?: unknown; aCode?: unknown })?.code ?? (r as { aCode?: unknown })?.aCode;
    return `Row ${i + 1}${code ? ` (${String(code)})` : ''}`;
  },
): { data: (RegisterData[K] & RowMeta)[]; issues: FieldIssue[] } {
  const data: (RegisterData[K] & RowMeta)[] = [];
  const issues: FieldIssue[] = [];
  rows.forEach((row, i) => {
    const meta = rowMeta.safeParse(row);
    const parsed = ROW_SCHEMAS[kind].safeParse(row);
    if (!meta.success) {
      issues.push({ path: `rows[${i}].id`, message: `${label(i, row)}: id, version and key are malformed.` });
      return;
    }
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path.map(String).join('.') || 'row';
        issues.push({ path: `rows[${i}].${field}`, message: `${label(i, row)}, ${field}: ${issue.message}` });
      }
      return;
    }
    data.push({ ...(parsed.data as RegisterData[K]), ...meta.data });
  });
  return { data, issues };
}

// The rows of the four registers, one zod schema each, shared by the grids (checking a cell as
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
import type { FieldIssue } from '@/lib/errors';

export const REGISTER_KINDS = ['items', 'risks', 'activities', 'correlations'] as const;
export type RegisterKind = (typeof REGISTER_KINDS)[number];

export const RISK_STATUSES = ['open', 'mitigating', 'closed', 'occurred'] as const;
export const RISK_RESPONSES = ['avoid', 'reduce', 'transfer', 'accept'] as const;
export const RISK_IMPACT_TYPES = ['fixed', 'uniform', 'triangular', 'pert', 'lognormal'] as const;
export const BASES = ['lump-sum', 'per-day'] as const;

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
  basis: z.enum(BASES, { message: 'Choose lump sum or per day.' }).default('lump-sum'),
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
    if (!row.distType)
      ctx.addIssue({
        code: 'custom',
        path: ['distType'],
        message: 'Choose the distribution of the rate per day (Fixed for a set rate).',
      });
  } else if (row.activityCode) {
    ctx.addIssue({
      code: 'custom',
      path: ['activityCode'],
      message: 'Only per-day lines take an activity; clear it or set the basis to per day.',
    });
  }
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
    z.enum(RISK_IMPACT_TYPES, { message: `${label}: choose fixed, uniform, triangular, pert or lognormal.` }),
  );

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
  costLow: optNumber('Cost low', MONEY),
  costMode: optNumber('Cost most likely', MONEY),
  costHigh: optNumber('Cost high', MONEY),
  delayType: impactType('Delay'),
  delayLow: optNumber('Delay low', DAYS),
  delayMode: optNumber('Delay most likely', DAYS),
  delayHigh: optNumber('Delay high', DAYS),
  activityCode: optText(40, 'Activity'),
  mitigationCost: optNumber('Mitigation cost', MONEY),
  postProbability: orNull(probability('Post-mitigation probability')),
  postCostLow: optNumber('Post cost low', MONEY),
  postCostMode: optNumber('Post cost most likely', MONEY),
  postCostHigh: optNumber('Post cost high', MONEY),
  postDelayLow: optNumber('Post delay low', DAYS),
  postDelayMode: optNumber('Post delay most likely', DAYS),
  postDelayHigh: optNumber('Post delay high', DAYS),
};

type RiskShape = z.infer<z.ZodObject<typeof riskShape>>;
export type ImpactPrefix = 'cost' | 'delay' | 'postCost' | 'postDelay';

export function impactParts(row: Partial<Record<string, unknown>>, prefix: ImpactPrefix): DistParts | null {
  const type = (
    prefix.startsWith('post') ? row[prefix === 'postCost' ? 'costType' : 'delayType'] : row[`${prefix}Type`]
  ) as DistType | null;
  if (!type) return null;
  const n = (k: string) => (row[`${prefix}${k}`] as number | null | undefined) ?? null;
  return { type, low: n('Low'), mode: n('Mode'), high: n('High') };
}

const anyPost = (row: RiskShape, prefix: 'postCost' | 'postDelay') =>
  [row[`${prefix}Low`], row[`${prefix}Mode`], row[`${prefix}High`]].some((v) => v !== null);

function refineRisk(row: RiskShape, ctx: Ctx) {
  if (!row.costType && !row.delayType) {
    ctx.addIssue({
      code: 'custom',
      path: ['costType'],
      message: 'A risk needs a cost impact, a delay, or both.',
    });
  }
  for (const prefix of ['cost', 'delay', 'postCost', 'postDelay'] as const) {
    const parts = impactParts(row, prefix);
    if (!parts) {
      if (prefix.startsWith('post') && anyPost(row, prefix as 'postCost' | 'postDelay')) {
        ctx.addIssue({
          code: 'custom',
          path: [`${prefix}Mode`],
          message: `Post-mitigation ${prefix === 'postCost' ? 'cost' : 'delay'} needs a ${prefix === 'postCost' ? 'cost' : 'delay'} type before it.`,
        });
      }
      continue;
    }
    if (prefix.startsWith('post') && !anyPost(row, prefix as 'postCost' | 'postDelay')) continue;
    refineDist(
      ctx,
      parts.type,
      parts,
      (p) => (p === 'type' ? `${prefix}Type` : `${prefix}${p[0].toUpperCase()}${p.slice(1)}`),
      (c) => {
        if (
          prefix.toLowerCase().includes('delay') &&
          [c.low, c.mode, c.high].some((v) => v !== null && v !== undefined && v < 0)
        ) {
          ctx.addIssue({ code: 'custom', path: [`${prefix}Low`], message: 'A delay cannot be negative.' });
        }
      },
    );
  }
  if (row.delayType && !row.activityCode) {
    ctx.addIssue({
      code: 'custom',
      path: ['activityCode'],
      message: 'A delay needs the activity it lengthens.',
    });
  }
  if (row.mitigationCost !== null && row.mitigationCost < 0) {
    ctx.addIssue({
      code: 'custom',
      path: ['mitigationCost'],
      message: 'Mitigation cost cannot be negative.',
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

export const ROW_SCHEMAS = {
  items: lineItemSchema,
  risks: riskSchema,
  activities: activitySchema,
  correlations: correlationSchema,
} as const;

export type RegisterData = {
  items: LineItemData;
  risks: RiskData;
  activities: ActivityData;
  correlations: CorrelationData;
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

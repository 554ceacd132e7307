// A risk event's distributions as the flat cells of its row: the cost and the delay before and
// after mitigation (`cost…`, `delay…`, `postCost…`, `postDelay…`), and the response's cost
// (`mitigationType`, `mitigationLow`, `mitigationCost`, `mitigationHigh`). The post cells take
// the type of the impact before mitigation; a missing post impact keeps the value before it.

import { meanOf, specFromParts, type DistParts, type DistType } from './dist-fields';

export const RISK_IMPACT_TYPES = ['fixed', 'uniform', 'triangular', 'pert', 'normal', 'lognormal'] as const;
export const RISK_SIZES = ['linked', 'independent'] as const;
/** A response's cost: one amount, or a range. */
export const MITIGATION_TYPES = ['fixed', 'uniform', 'triangular', 'pert'] as const;

export type ImpactPrefix = 'cost' | 'delay' | 'postCost' | 'postDelay';
export const IMPACT_CELLS = ['Low', 'Mode', 'High', 'Mean', 'Sd'] as const;

type Cells = Partial<Record<string, unknown>>;
const num = (row: Cells, field: string) => (row[field] as number | null | undefined) ?? null;

/** The impact type that applies to a prefix's cells (post impacts share the type before). */
export const impactTypeField = (prefix: ImpactPrefix) =>
  prefix === 'postCost' ? 'costType' : prefix === 'postDelay' ? 'delayType' : `${prefix}Type`;

/** The distribution cells of one impact, or null when it has no type. */
export function impactParts(row: Cells, prefix: ImpactPrefix): DistParts | null {
  const type = row[impactTypeField(prefix)] as DistType | null | undefined;
  if (!type) return null;
  return {
    type,
    low: num(row, `${prefix}Low`),
    mode: num(row, `${prefix}Mode`),
    high: num(row, `${prefix}High`),
    mean: num(row, `${prefix}Mean`),
    sd: num(row, `${prefix}Sd`),
  };
}

/** Whether any post-mitigation cell of the impact holds a value (an empty post keeps the pre). */
export const anyPostCell = (row: Cells, prefix: 'postCost' | 'postDelay') =>
  IMPACT_CELLS.some((k) => num(row, `${prefix}${k}`) !== null);

/** The cell of one impact part: `costLow`, `postDelaySd`… */
export const impactCell = (prefix: ImpactPrefix, part: string) =>
  part === 'type' ? impactTypeField(prefix) : `${prefix}${part[0].toUpperCase()}${part.slice(1)}`;

/**
 * The response's cost cells, or null when none is given. Without a type, an amount alone is a
 * fixed cost (how a row read before ranges were possible).
 */
export function mitigationParts(row: Cells): DistParts | null {
  const type = row.mitigationType as DistType | null | undefined;
  const mode = num(row, 'mitigationCost');
  if (!type) return mode === null ? null : { type: 'fixed', mode };
  return { type, low: num(row, 'mitigationLow'), mode, high: num(row, 'mitigationHigh') };
}

/** The cell of one part of the response's cost. */
export const mitigationCell = (part: string) =>
  part === 'type'
    ? 'mitigationType'
    : part === 'mode'
      ? 'mitigationCost'
      : `mitigation${part[0].toUpperCase()}${part.slice(1)}`;

/** Splits a typed or pasted list of codes ("A-10, A-20; A-30") into codes, blanks dropped. */
export function readCodeList(raw: unknown): string[] {
  if (Array.isArray(raw)) return raw.map(String);
  if (raw === null || raw === undefined) return [];
  return String(raw)
    .split(/[,;\s]+/)
    .map((s) => s.trim())
    .filter(Boolean);
}

export const formatCodeList = (value: unknown) =>
  Array.isArray(value) ? value.join(', ') : String(value ?? '');

/** The mean of one impact (after mitigation: the post cells, or the impact before when none is given). */
export function impactMean(row: Cells, prefix: ImpactPrefix): number | null {
  const post = prefix === 'postCost' || prefix === 'postDelay';
  const parts =
    post && !anyPostCell(row, prefix)
      ? impactParts(row, prefix === 'postCost' ? 'cost' : 'delay')
      : impactParts(row, prefix);
  if (!parts) return null;
  const r = specFromParts(parts);
  return r.ok ? meanOf(r.spec) : null;
}

/** The mean of the response's cost (0 when none is given; null when its cells are incomplete). */
export function mitigationMean(row: Cells): number | null {
  const parts = mitigationParts(row);
  if (!parts) return 0;
  const r = specFromParts(parts);
  return r.ok ? meanOf(r.spec) : null;
}

export type RiskDirection = 'threat' | 'opportunity' | 'both';

/**
 * Whether a risk is a threat (it adds cost or time on average), an opportunity (it saves them) or
 * both (it saves one and costs the other), from the means of its impacts before mitigation.
 */
export function riskDirection(row: Cells): RiskDirection | null {
  const means = (['cost', 'delay'] as const)
    .map((p) => impactMean(row, p))
    .filter((m): m is number => m !== null && m !== 0);
  if (!means.length) return null;
  if (means.every((m) => m < 0)) return 'opportunity';
  return means.some((m) => m < 0) ? 'both' : 'threat';
}

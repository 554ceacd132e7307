// Parameter checks shared by the distribution factories. Each throws an InputError whose message
// names the entry and the field, e.g. `C12.dist.high: must be greater than low (got 5 ≤ 10)`.

import { InputError } from '../errors';

/** Where a distribution sits in the model: the entry label and the field prefix ("dist", "ratePerDay"…). */
export interface DistLocation {
  where: string;
  field: string;
}

export const fmt = (x: number): string => (Number.isFinite(x) ? String(+x.toPrecision(12)) : String(x));

export function fail(at: DistLocation, param: string, problem: string): never {
  throw new InputError(at.where, [at.field, param].filter(Boolean).join('.'), problem);
}

export function requireFinite(at: DistLocation, param: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    fail(at, param, `must be a finite number (got ${String(value)})`);
  }
}

export function requireGreater(
  at: DistLocation,
  param: string,
  value: number,
  otherName: string,
  other: number,
) {
  if (!(value > other))
    fail(at, param, `must be greater than ${otherName} (got ${fmt(value)} ≤ ${fmt(other)})`);
}

export function requirePositive(at: DistLocation, param: string, value: number): void {
  if (!(value > 0)) fail(at, param, `must be greater than 0 (got ${fmt(value)})`);
}

export function requireBetween(at: DistLocation, param: string, value: number, low: number, high: number) {
  if (!(value >= low && value <= high)) {
    fail(at, param, `must lie between low and high (got ${fmt(value)} outside ${fmt(low)}–${fmt(high)})`);
  }
}

// One entry point from a model's DIST object to a Distribution.

import type { DistSpec } from '../formats';
import type { DistLocation } from './checks';
import { createFixed } from './fixed';
import { createLognormal } from './lognormal';
import { createNormal } from './normal';
import { createPert } from './pert';
import { createTriangular } from './triangular';
import { createUniform } from './uniform';
import type { Distribution } from './types';

export type { Distribution, DistributionKind } from './types';
export type { DistLocation } from './checks';
export { createFixed, createUniform, createTriangular, createPert, createNormal, createLognormal };

type Factory<T extends DistSpec['type']> = (
  spec: Extract<DistSpec, { type: T }>,
  at: DistLocation,
) => Distribution;

const FACTORIES: { [T in DistSpec['type']]: Factory<T> } = {
  fixed: createFixed,
  uniform: createUniform,
  triangular: createTriangular,
  pert: createPert,
  normal: createNormal,
  lognormal: createLognormal,
};

export function createDistribution(spec: DistSpec, at: DistLocation): Distribution {
  return (FACTORIES[spec.type] as Factory<DistSpec['type']>)(spec, at);
}

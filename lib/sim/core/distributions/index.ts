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

export function createDistribution(spec: DistSpec, at: DistLocation): Distribution {
  switch (spec.type) {
    case 'fixed':
      return createFixed(spec, at);
    case 'uniform':
      return createUniform(spec, at);
    case 'triangular':
      return createTriangular(spec, at);
    case 'pert':
      return createPert(spec, at);
    case 'normal':
      return createNormal(spec, at);
    case 'lognormal':
      return createLognormal(spec, at);
  }
}

// Distributions: moments and quantiles against their closed forms and against jstat, an
// independent implementation; P10–P90 fits against reference bounds computed by a separate
// solver (./fixtures/make-reference.mjs).
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  createFixed,
  createLognormal,
  createNormal,
  createPert,
  createTriangular,
  createUniform,
} from '../distributions';
import { createBetaQuantileTable } from '../math/beta-quantile-table';
import { normalCdf, normalQuantile } from '../math/normal';
import { normalQuantilesInto } from '../math/normal-quantile-table';
import fits from './fixtures/p10-p90-fits.json';

const at = { where: 'X1', field: 'dist' };
const grid = Array.from({ length: 99 }, (_, i) => (i + 1) / 100).concat([1e-6, 1e-3, 0.999, 1 - 1e-6]);
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

describe('standard normal', () => {
  it('matches published values (Abramowitz & Stegun 1964, table 26.1)', () => {
    expect(normalCdf(1.959963984540054)).toBeCloseTo(0.975, 14);
    expect(normalCdf(-1)).toBeCloseTo(0.15865525393145707, 14);
    expect(normalQuantile(0.9)).toBeCloseTo(1.2815515655446004, 13);
    expect(normalQuantile(0.5)).toBe(0);
  });

  it('agrees with jstat and inverts itself (Φ(Φ⁻¹(p)) = p)', () => {
    for (let z = -8; z <= 8; z += 0.01)
      expect(Math.abs(normalCdf(z) - jStat.normal.cdf(z, 0, 1))).toBeLessThan(1e-14);
    for (const p of grid) {
      expect(Math.abs(normalQuantile(p) - jStat.normal.inv(p, 0, 1))).toBeLessThan(1e-8);
      // Relative to the smaller tail; Φ near 1 is computed as 1 − tail, so allow 1e-9.
      expect(Math.abs(normalCdf(normalQuantile(p)) - p) / Math.min(p, 1 - p)).toBeLessThan(1e-9);
    }
  });
});

describe('batch normal quantiles (shared table)', () => {
  it('are within 1e-9 of the exact Φ⁻¹ everywhere', () => {
    const n = 400_000;
    const u = Float64Array.from({ length: n }, (_, i) => (i + 0.37) / n);
    const out = new Float64Array(n);
    normalQuantilesInto(u, out, n, 0, 1);
    let worst = 0;
    for (let i = 0; i < n; i++) worst = Math.max(worst, Math.abs(out[i] - normalQuantile(u[i])));
    expect(worst).toBeLessThan(1e-9);
    const lognormal = createLognormal({ p10: 80, p90: 200 }, at);
    const batch = new Float64Array(grid.length);
    lognormal.quantileInto(Float64Array.from(grid), batch, grid.length);
    grid.forEach((p, i) => expect(rel(batch[i], lognormal.quantile(p))).toBeLessThan(1e-8));
  });
});

describe('fixed', () => {
  it('is its value (degenerate)', () => {
    const d = createFixed({ value: 7 }, at);
    expect([d.mean, d.variance, d.base, d.quantile(0.3), d.cdf(6.9), d.cdf(7)]).toEqual([7, 0, 7, 7, 0, 1]);
    expect(d.degenerate).toBe(true);
  });
});

describe('uniform', () => {
  // Mean (a+b)/2, variance (b−a)²/12; JKB vol. 2 ch. 26.
  it('has the textbook moments and agrees with jstat', () => {
    const d = createUniform({ low: 10, high: 30 }, at);
    expect(d.mean).toBe(20);
    expect(d.variance).toBeCloseTo(400 / 12, 12);
    expect(d.variance).toBeCloseTo(jStat.uniform.variance(10, 30), 12);
    for (const p of grid) expect(d.quantile(p)).toBeCloseTo(jStat.uniform.inv(p, 10, 30), 10);
    expect(d.cdf(15)).toBeCloseTo(0.25, 15);
  });
});

describe('triangular', () => {
  const d = createTriangular({ low: 100, mode: 120, high: 180 }, at);

  // Mean (a+b+c)/3 and variance (a²+b²+c²−ab−ac−bc)/18: Kotz & van Dorp (2004) ch. 1.
  it('has the textbook moments, as jstat', () => {
    expect(d.mean).toBeCloseTo(400 / 3, 12);
    expect(d.variance).toBeCloseTo(
      (100 ** 2 + 180 ** 2 + 120 ** 2 - 100 * 180 - 100 * 120 - 180 * 120) / 18,
      10,
    );
    expect(d.mean).toBeCloseTo(jStat.triangular.mean(100, 180, 120), 12);
    expect(d.variance).toBeCloseTo(jStat.triangular.variance(100, 180, 120), 10);
    expect(d.base).toBe(120);
  });

  // P80 from the closed-form inverse: 0.8 > F(c) = 0.25, so P80 = b − √((1 − 0.8)(b − a)(b − c)).
  it('gives P80 by the closed-form inverse CDF', () => {
    expect(d.quantile(0.8)).toBeCloseTo(180 - Math.sqrt(0.2 * 80 * 60), 12);
    expect(d.quantile(0.1)).toBeCloseTo(100 + Math.sqrt(0.1 * 80 * 20), 12);
  });

  it('inverts its CDF and matches jstat on a grid', () => {
    for (const p of grid) {
      expect(d.cdf(d.quantile(p))).toBeCloseTo(p, 12);
      expect(rel(d.quantile(p), jStat.triangular.inv(p, 100, 180, 120))).toBeLessThan(1e-12);
    }
  });

  // Plumbing: the batch form (both sides computed, one kept) gives the single form's values to
  // the bit, on either side of the mode, at it, and for a mode at either end.
  it('batch and single quantiles agree to the bit', () => {
    const u = Float64Array.from([...grid, 0.25, 0.25 - 2 ** -53, 0.25 + 2 ** -54]);
    for (const t of [
      d,
      createTriangular({ low: 0, mode: 0, high: 9 }, at),
      createTriangular({ low: 1, mode: 5, high: 5 }, at),
    ]) {
      const out = new Float64Array(u.length);
      t.quantileInto(u, out, u.length);
      expect(Array.from(out)).toEqual(Array.from(u, (p) => t.quantile(p)));
    }
  });
});

describe('beta-PERT', () => {
  const d = createPert({ low: 100, mode: 120, high: 180 }, at);
  const alpha = 1 + (4 * 20) / 80;
  const beta = 1 + (4 * 60) / 80;

  // E = (a + 4c + b)/6, Var = (E − a)(b − E)/7 for λ = 4: Vose (2008) §9; Malcolm et al. (1959).
  it('has the beta-PERT moments, equal to the scaled beta(α, β) moments from jstat', () => {
    expect(d.mean).toBeCloseTo((100 + 4 * 120 + 180) / 6, 12);
    expect(d.variance).toBeCloseTo(((d.mean - 100) * (180 - d.mean)) / 7, 10);
    expect(d.mean).toBeCloseTo(100 + 80 * jStat.beta.mean(alpha, beta), 10);
    expect(d.variance).toBeCloseTo(80 ** 2 * jStat.beta.variance(alpha, beta), 8);
  });

  it('has quantiles matching jstat.beta.inv within 1e-6 of the range', () => {
    for (const p of grid)
      expect(Math.abs(d.quantile(p) - (100 + 80 * jStat.beta.inv(p, alpha, beta))) / 80).toBeLessThan(1e-6);
    for (const p of grid) expect(d.cdf(d.quantile(p))).toBeCloseTo(p, 6);
  });

  // The quantile table against jstat.ibetainv over the whole beta-PERT family (α + β = 6).
  it('has a quantile table accurate to 1e-6 for every shape', () => {
    let worst = 0;
    for (let a = 1; a <= 5.0001; a += 0.25) {
      const table = createBetaQuantileTable(a, 6 - a);
      for (let i = 1; i < 4000; i++) {
        const u = (i - 0.31) / 4000;
        worst = Math.max(worst, Math.abs(table.quantile(u) - jStat.ibetainv(u, a, 6 - a)));
      }
    }
    expect(worst).toBeLessThan(1e-6);
  });

  it('batch and single quantiles agree to the bit', () => {
    const u = Float64Array.from(grid);
    const out = new Float64Array(u.length);
    d.quantileInto(u, out, u.length);
    expect(Array.from(out)).toEqual(grid.map((p) => d.quantile(p)));
  });
});

describe('normal and lognormal', () => {
  it('normal: mean, variance, quantiles as jstat', () => {
    const d = createNormal({ mean: 50, sd: 4 }, at);
    expect([d.mean, d.variance, d.base]).toEqual([50, 16, 50]);
    for (const p of grid) expect(rel(d.quantile(p), jStat.normal.inv(p, 50, 4))).toBeLessThan(1e-9);
  });

  // From (p10, p90): μ = (ln p10 + ln p90)/2, σ = (ln p90 − ln p10)/(2 z₀.₉); JKB vol. 1 ch. 14.
  it('lognormal from p10/p90 puts them at the 10th and 90th percentiles', () => {
    const d = createLognormal({ p10: 80, p90: 200 }, at);
    expect(d.quantile(0.1)).toBeCloseTo(80, 9);
    expect(d.quantile(0.9)).toBeCloseTo(200, 9);
    expect(d.base).toBeCloseTo(Math.sqrt(80 * 200), 9);
    const mu = Math.log(Math.sqrt(80 * 200));
    const sigma = Math.log(200 / 80) / (2 * 1.2815515655446004);
    expect(d.mean).toBeCloseTo(jStat.lognormal.mean(mu, sigma), 9);
    expect(d.variance / jStat.lognormal.variance(mu, sigma)).toBeCloseTo(1, 12);
  });

  it('lognormal from mean/sd reproduces them (σ² = ln(1 + s²/m²), μ = ln m − σ²/2)', () => {
    const d = createLognormal({ mean: 1000, sd: 300 }, at);
    expect(d.mean).toBeCloseTo(1000, 9);
    expect(Math.sqrt(d.variance)).toBeCloseTo(300, 9);
    for (const p of grid) expect(d.cdf(d.quantile(p))).toBeCloseTo(p, 10);
  });
});

describe('P10–P90 ranges', () => {
  // Reference bounds from an independent 2-D Newton solver on jstat's CDFs (fixture script).
  it.each(fits.fits)('$type $p10/$mode/$p90 fits the reference bounds', (f) => {
    const create = f.type === 'pert' ? createPert : createTriangular;
    const d = create({ low: f.p10, mode: f.mode, high: f.p90, range: 'p10-p90' }, at);
    const span = f.p90 - f.p10;
    expect(Math.abs(d.support[0] - f.low) / span).toBeLessThan(1e-6);
    expect(Math.abs(d.support[1] - f.high) / span).toBeLessThan(1e-6);
    expect(d.cdf(f.p10)).toBeCloseTo(0.1, 9);
    expect(d.cdf(f.p90)).toBeCloseTo(0.9, 9);
    expect(d.base).toBe(f.mode);
  });
});

describe('parameter checks name the entry and the field', () => {
  const cases: [string, () => unknown, string][] = [
    [
      'uniform high ≤ low',
      () => createUniform({ low: 10, high: 5 }, { where: 'C12', field: 'dist' }),
      'C12.dist.high: must be greater than low (got 5 ≤ 10)',
    ],
    [
      'triangular high ≤ low',
      () => createTriangular({ low: 10, mode: 10, high: 10 }, at),
      'X1.dist.high: must be greater than low (got 10 ≤ 10)',
    ],
    [
      'pert mode outside',
      () => createPert({ low: 1, mode: 5, high: 4 }, at),
      'X1.dist.mode: must lie between low and high (got 5 outside 1–4)',
    ],
    [
      'normal sd ≤ 0',
      () => createNormal({ mean: 1, sd: 0 }, at),
      'X1.dist.sd: must be greater than 0 (got 0)',
    ],
    [
      'lognormal p10 ≤ 0',
      () => createLognormal({ p10: -1, p90: 4 }, at),
      'X1.dist.p10: must be greater than 0 (got -1)',
    ],
    [
      'lognormal p90 ≤ p10',
      () => createLognormal({ p10: 5, p90: 3 }, at),
      'X1.dist.p90: must be greater than p10 (got 3 ≤ 5)',
    ],
    [
      'lognormal mean ≤ 0',
      () => createLognormal({ mean: 0, sd: 1 }, at),
      'X1.dist.mean: must be greater than 0 (got 0)',
    ],
    [
      'non-finite',
      () => createFixed({ value: NaN }, { where: 'A2', field: 'duration' }),
      'A2.duration.value: must be a finite number (got NaN)',
    ],
  ];
  it.each(cases)('%s', (_name, make, message) => {
    expect(make).toThrow(message);
  });
});

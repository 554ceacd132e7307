// The command line with a version 2 model: the mitigation comparison and the top drivers in the
// summary, and a precision goal at any P-level.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const tsx = path.join('node_modules', '.bin', 'tsx');
const simulate = (...args: string[]) =>
  spawnSync(tsx, ['scripts/simulate.ts', ...args], { encoding: 'utf8' });
const dir = mkdtempSync(path.join(tmpdir(), 'outturn-cli-v2-'));

describe('npm run simulate (version 2)', () => {
  it('prints the mitigation comparison and runs to a precision goal at P90', () => {
    const out = path.join(dir, 'result.json');
    const run = simulate(
      'tests/fixtures/sim/v2-project.json',
      '--threads',
      '1',
      '--iterations',
      '2000',
      '--precision',
      '1',
      '--level',
      'P90',
      '--out',
      out,
    );
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Mitigation \(headline: after mitigation\)/);
    expect(run.stdout).toMatch(/cost P80 +[\d,]+ +[\d,]+ +[-+][\d,]+/);
    expect(run.stdout).toMatch(/Top cost drivers: .*\[driver\]/);
    const result = JSON.parse(readFileSync(out, 'utf8'));
    expect(result.version).toBe(2);
    // The goal is met for both totals: the P90 interval's half-width within ±1 % of P90.
    for (const t of [result.cost, result.duration]) {
      const [lo, hi] = t.percentileCI95.P90;
      expect((hi - lo) / 2 / t.percentiles.P90).toBeLessThanOrEqual(0.01);
    }
  });

  it('refuses a bad precision or level', () => {
    const bad = simulate('tests/fixtures/sim/v2-project.json', '--precision', '0.5', '--level', 'P100');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--level must be a P-level such as P80 \(got "P100"\)/);
    const none = simulate('tests/fixtures/sim/v2-project.json', '--level', 'P90');
    expect(none.status).toBe(2);
    expect(none.stderr).toMatch(/--level and --max-iterations need --precision/);
  });
});

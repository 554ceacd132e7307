// The command line: writes a result that reproduces to the bit from its seed, and refuses a bad
// model with a message naming the entry, without writing anything.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const tsx = path.join('node_modules', '.bin', 'tsx');
const simulate = (...args: string[]) =>
  spawnSync(tsx, ['scripts/simulate.ts', ...args], { encoding: 'utf8' });
const dir = mkdtempSync(path.join(tmpdir(), 'outturn-cli-'));

describe('npm run simulate', () => {
  it('prints a summary, writes the result, and reproduces it from the seed', () => {
    const first = path.join(dir, 'first.json');
    const second = path.join(dir, 'second.json');
    const args = [
      'tests/fixtures/sim/small-project.json',
      '--iterations',
      '3000',
      '--seed',
      '5',
      '--sampling',
      'mc',
    ];
    const a = simulate(...args, '--threads', '2', '--out', first);
    expect(a.status).toBe(0);
    expect(a.stdout).toMatch(/3,000 iterations, Monte Carlo, seed 5, 2 threads/);
    expect(a.stdout).toMatch(/P80/);
    expect(a.stdout).toMatch(/Top cost drivers: /);
    const b = simulate(...args, '--threads', '1', '--out', second);
    expect(b.status).toBe(0);
    const ra = JSON.parse(readFileSync(first, 'utf8'));
    const rb = JSON.parse(readFileSync(second, 'utf8'));
    expect(ra.format).toBe('outturn-result');
    expect(ra.iterations).toBe(3000);
    expect({ ...ra, elapsedMs: 0 }).toEqual({ ...rb, elapsedMs: 0 });
  });

  it('refuses a bad model with exit status 1, naming the entries, and writes nothing', () => {
    const out = path.join(dir, 'bad.json');
    const r = simulate('tests/fixtures/sim/bad-project.json', '--out', out);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain(
      'items[1] (C2).dist.mode: must lie between low and high (got 95 outside 50–90)',
    );
    expect(r.stderr).toContain('activities[1] (A2).predecessors[0]: unknown activity "A9"');
    expect(existsSync(out)).toBe(false);
  });

  it('refuses bad options and missing files', () => {
    expect(simulate('tests/fixtures/sim/small-project.json', '--sampling', 'sobol').status).toBe(2);
    const missing = simulate(path.join(dir, 'none.json'));
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/no such file/);
  });

  it('runs bounded with --bounded: the same P-values as in memory, and not with --precision', () => {
    // Plumbing: both forms read the same iterations, so the order statistics agree exactly.
    const memory = path.join(dir, 'memory.json');
    const bounded = path.join(dir, 'bounded.json');
    const args = [
      'tests/fixtures/sim/small-project.json',
      '--iterations',
      '5000',
      '--seed',
      '9',
      '--threads',
      '1',
    ];
    expect(simulate(...args, '--out', memory).status).toBe(0);
    expect(simulate(...args, '--bounded', '--out', bounded).status).toBe(0);
    const m = JSON.parse(readFileSync(memory, 'utf8'));
    const b = JSON.parse(readFileSync(bounded, 'utf8'));
    expect(b.cost.percentiles).toEqual(m.cost.percentiles);
    expect(b.cost.percentileCI95).toEqual(m.cost.percentileCI95);
    const refused = simulate(...args, '--bounded', '--precision', '1');
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/--bounded does not go with --precision/);
  });
});

// Command line (run from its bundle, .build/simulate.mjs, built by scripts/build-worker.mjs):
// npm run simulate -- MODEL.json [--iterations N] [--seed S] [--sampling mc|lhs]
//                                   [--threads T] [--out RESULT.json]
//                                   [--precision PCT [--level Pk] [--max-iterations N]] [--bounded]
// With --precision the run doubles its iterations until the chosen P-value (P80 unless --level
// says otherwise) of cost, and of duration, is known to ±PCT % (95% interval), up to the cap.
// With --bounded (the default above 1,000,000 iterations) the run keeps its memory bounded: two
// passes over the iterations, nothing kept per iteration (docs/architecture.md, bounded runs).
// Prints a short summary; with --out writes the result file. A model that fails validation
// exits with status 1 and a message per offending entry, and nothing is written.

import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { parseArgs } from 'node:util';
import { type Model, ModelValidationError, summaryText, type PrecisionGoal, type Sampling } from '../lib/sim';
import { BUILD_WORKER_COMMAND, defaultWorkerFile, runSimulation } from '../lib/sim/runtime';

const USAGE =
  'usage: npm run simulate -- MODEL.json [--iterations N] [--seed S] [--sampling mc|lhs] [--threads T] [--out RESULT.json]\n' +
  '       [--precision PCT [--level Pk] [--max-iterations N]]   (e.g. --precision 0.5 --level P90)\n' +
  '       [--bounded]   (memory independent of the iterations; the default above 1,000,000)';

/** Default cap of a run to a precision goal. */
const DEFAULT_MAX_ITERATIONS = 1_000_000;

function fail(message: string, code: number): never {
  process.stderr.write(`${message}\n`);
  process.exit(code);
}

function positiveInt(name: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  if (!/^\d+$/.test(value) || Number(value) < 1)
    fail(`--${name} must be a positive integer (got "${value}")\n${USAGE}`, 2);
  return Number(value);
}

/** Threads load the bundled worker: build it with the build script when it is missing. */
function ensureWorker() {
  if (existsSync(defaultWorkerFile())) return;
  // The build script's own output goes to stderr, so stdout stays the summary alone.
  const built = spawnSync(process.execPath, ['scripts/build-worker.mjs'], { stdio: ['ignore', 2, 2] });
  if (built.status !== 0) fail(`The engine worker did not build; run "${BUILD_WORKER_COMMAND}".`, 1);
}

async function main() {
  let parsed;
  try {
    parsed = parseArgs({
      allowPositionals: true,
      options: {
        iterations: { type: 'string' },
        seed: { type: 'string' },
        sampling: { type: 'string' },
        threads: { type: 'string' },
        out: { type: 'string' },
        precision: { type: 'string' },
        level: { type: 'string' },
        'max-iterations': { type: 'string' },
        bounded: { type: 'boolean' },
        help: { type: 'boolean', short: 'h' },
      },
    });
  } catch (e) {
    fail(`${(e as Error).message}\n${USAGE}`, 2);
  }
  const { values, positionals } = parsed;
  if (values.help) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (positionals.length !== 1) fail(USAGE, 2);
  const file = positionals[0];
  const iterations = positiveInt('iterations', values.iterations);
  const threads = positiveInt('threads', values.threads) ?? availableParallelism();
  const sampling = values.sampling as Sampling | undefined;
  if (sampling !== undefined && sampling !== 'mc' && sampling !== 'lhs') {
    fail(`--sampling must be mc or lhs (got "${sampling}")\n${USAGE}`, 2);
  }
  const precision = precisionGoal(values.precision, values.level, values['max-iterations']);
  if (precision && values.bounded) fail(`--bounded does not go with --precision\n${USAGE}`, 2);
  const seed =
    values.seed === undefined ? undefined : /^-?\d+$/.test(values.seed) ? Number(values.seed) : values.seed;

  let json: unknown;
  try {
    json = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    fail(
      `${file}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : `not valid JSON (${(e as Error).message})`}`,
      1,
    );
  }
  if (threads > 1) ensureWorker();
  const showProgress = process.stderr.isTTY;
  // runSimulation validates the model (once: a second validation here would cost as much again)
  // and refuses an invalid one with every issue.
  const result = await runSimulation(json, {
    iterations,
    seed,
    sampling,
    threads,
    // Nothing else runs in this process: its own thread computes too, beside threads − 1 workers.
    computeHere: true,
    ...(precision ? { precision } : {}),
    ...(values.bounded ? { bounded: true } : {}),
    onProgress: showProgress
      ? ({ done, total, iterations: drawn }) =>
          process.stderr.write(
            drawn === undefined
              ? `\r${Math.round((100 * done) / total)}% of ${total} iterations`
              : `\r${Math.round((100 * done) / total)}% of two passes over ${total / 2} iterations`,
          )
      : undefined,
  }).catch((e: unknown) => {
    if (!(e instanceof ModelValidationError)) throw e;
    fail(
      `${file}: the model is not valid:\n${e.issues.map((i) => `  ${i.path ? `${i.path}: ` : ''}${i.message}`).join('\n')}`,
      1,
    );
  });
  // Valid, so these are the model's own fields.
  const model = json as Model;
  if (showProgress) process.stderr.write('\r\x1b[K');
  process.stdout.write(
    `${summaryText(result, { name: model.name, currency: model.currency, threads, targets: model.targets })}\n`,
  );
  if (values.out) {
    writeFileSync(values.out, `${JSON.stringify(result, null, 2)}\n`);
    process.stdout.write(`\nResult written to ${values.out}\n`);
  }
}

function precisionGoal(
  precision: string | undefined,
  level: string | undefined,
  cap: string | undefined,
): PrecisionGoal | null {
  if (precision === undefined) {
    if (level !== undefined || cap !== undefined)
      fail(`--level and --max-iterations need --precision\n${USAGE}`, 2);
    return null;
  }
  const pct = Number(precision);
  if (!/^\d*\.?\d+$/.test(precision) || !(pct > 0 && pct < 100)) {
    fail(`--precision must be a percentage between 0 and 100 (got "${precision}")\n${USAGE}`, 2);
  }
  const m = level === undefined ? ['P80', '80'] : /^P(\d{1,2})$/.exec(level);
  if (!m || Number(m[1]) < 1) fail(`--level must be a P-level such as P80 (got "${level}")\n${USAGE}`, 2);
  return {
    relative: pct / 100,
    level: Number(m[1]) / 100,
    maxIterations: positiveInt('max-iterations', cap) ?? DEFAULT_MAX_ITERATIONS,
  };
}

main().catch((e: unknown) => fail(e instanceof Error ? e.message : String(e), 1));

import 'server-only';
/**
 * A big run split across workers (queue mode). The run's own job becomes the parent of its parts,
 * in BullMQ's step-job pattern: it claims the run, adds the first-pass parts as its children (a
 * range of whole chunks each, see lib/services/runs/split.ts) and waits for them without holding
 * a worker; when they are done it merges them into the second pass's request and adds the
 * second-pass parts; then it merges everything with finishBounded, computes the chart sample and
 * writes the outcome once. Any worker may run any part, the parts of one pass at the same time.
 *
 * Each part checks that the row still names the run's attempt before and while it works (every
 * progress write does), so a cancel or a lost attempt stops all parts; a part whose worker dies is
 * handed on by the stalled-job check and computed again, to the same numbers. Progress adds up
 * the parts' counts in a Redis hash. The result is the engine's to the bit whatever the split.
 */

import { runLogger } from '@/lib/log';
import { logUnexpected } from '@/lib/http/log-error';
import { WaitingChildrenError, type Job } from 'bullmq';
import {
  FirstPassFold,
  SecondPassFold,
  finishBounded,
  secondPassRequest,
  type FirstPassPart,
  type SecondPassPart,
  type SecondPassRequest,
} from '@/lib/sim';
import { heldRun, statusOf, writeSplitProgress, type ChunkRange } from '@/lib/services/runs/split';
import { notifyFinished, reasonOf, succeeded, writeOutcome } from '@/lib/services/runs/runner';
import { queuePrefix, redisConnection } from './redis';
import { RUN_JOB_ATTEMPTS, runQueue, type RunJobData, type RunPartJobData } from './run-queue';

/** The parts' progress reaches Redis and the row at most this often per part. */
const PART_PROGRESS_MS = 250;
/** The keys of a split run live a day at most (they are deleted when the run ends). */
const KEY_TTL_S = 24 * 3600;

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

const keyOf = (runId: number, token: string, what: 'request' | 'done' | 'first') =>
  `${queuePrefix()}:split:${runId}:${token}:${what}`;

/** A part's job id: one per run attempt, pass and range, so adding it again is one job. */
const partId = (runId: number, token: string, pass: 1 | 2, [from, to]: ChunkRange) =>
  `run-${runId}-${token.slice(0, 8)}-p${pass}-${from}-${to}`;

async function cleanUp(runId: number, token: string) {
  await redisConnection('queue')
    .del(keyOf(runId, token, 'request'), keyOf(runId, token, 'done'), keyOf(runId, token, 'first'))
    .catch(() => undefined);
}

/** Adds the parts of a pass not yet done as children of the run's job (adding twice is once). */
async function addParts(job: Job<RunJobData>, pass: 1 | 2, ranges: ChunkRange[]) {
  const { runId, organizationId, split } = job.data;
  await runQueue().addBulk(
    ranges.map((range) => ({
      name: 'run-part',
      data: {
        kind: 'run-part',
        runId,
        organizationId,
        token: split!.token,
        pass,
        from: range[0],
        to: range[1],
      } satisfies RunPartJobData,
      opts: {
        jobId: partId(runId, split!.token, pass, range),
        parent: { id: job.id!, queue: job.queueQualifiedName },
        attempts: RUN_JOB_ATTEMPTS,
        backoff: { type: 'exponential', delay: 2_000 },
        // A part that fails for good is recorded with the parent, which then fails the run.
        ignoreDependencyOnFailure: true,
        removeOnComplete: true,
        removeOnFail: { age: KEY_TTL_S },
      },
    })),
  );
}

/** Ends a split run that its parts found no longer this attempt's: a cancel is told by mail. */
async function stopped(runId: number, token: string): Promise<'finished'> {
  if ((await statusOf(runId)) === 'cancelled') await notifyFinished(runId);
  await cleanUp(runId, token);
  return 'finished';
}

/** Starts the split of a run this job has just claimed with `token`. */
export async function beginSplit(
  job: Job<RunJobData>,
  lockToken: string,
  token: string,
  ranges: ChunkRange[],
) {
  await job.updateData({ ...job.data, split: { token, pass: 1, ranges, startedAt: Date.now() } });
  return continueSplit(job, lockToken);
}

/**
 * One step of the parent: waits (throwing WaitingChildrenError, which frees the worker) while a
 * pass's parts are not all done, else moves on to the next pass or the merge.
 */
export async function continueSplit(job: Job<RunJobData>, lockToken: string): Promise<'finished'> {
  const { runId } = job.data;
  for (;;) {
    const split = job.data.split!;
    const { token, ranges } = split;
    const held = await heldRun(runId, token);
    if (!held) return stopped(runId, token);
    const failures = Object.values(await job.getIgnoredChildrenFailures());
    if (failures.length) {
      await writeOutcome(runId, token, {
        status: 'failed',
        failureReason: `A part of this run failed on its worker: ${failures[0]}`,
      });
      await notifyFinished(runId);
      await cleanUp(runId, token);
      return 'finished';
    }
    const values = await job.getChildrenValues();
    const valueOf = (pass: 1 | 2, range: ChunkRange) => {
      const id = partId(runId, token, pass, range);
      const key = Object.keys(values).find((k) => k.endsWith(`:${id}`));
      return key === undefined ? undefined : values[key];
    };
    const parts = ranges.map((r) => valueOf(split.pass, r));
    const missing = ranges.filter((_, i) => parts[i] === undefined);
    if (missing.length) {
      await addParts(job, split.pass, missing);
      if (await job.moveToWaitingChildren(lockToken)) throw new WaitingChildrenError();
      continue;
    }
    // A part that found the row taken gave nothing: the run was cancelled or handed on.
    if (parts.some((p) => p === null)) return stopped(runId, token);

    if (split.pass === 1) {
      const request = secondPassRequest(held.run, parts as FirstPassPart[]);
      await redisConnection('queue').set(
        keyOf(runId, token, 'request'),
        JSON.stringify(request),
        'EX',
        KEY_TTL_S,
      );
      await job.updateData({ ...job.data, split: { ...split, pass: 2 } });
      continue;
    }
    const first = ranges.map((r) => valueOf(1, r)) as FirstPassPart[];
    const stored = await redisConnection('queue').get(keyOf(runId, token, 'request'));
    if (!stored) throw new Error(`run ${runId}: the second pass's request is gone from Redis`);
    try {
      const result = finishBounded(held.run, first, JSON.parse(stored), parts as SecondPassPart[], {
        elapsedMs: Date.now() - split.startedAt,
      });
      await writeOutcome(runId, token, await succeeded(held.snapshot, held.settings, result, held.currency));
    } catch (e) {
      logUnexpected(runLogger(runId), 'Split run failed', e);
      await writeOutcome(runId, token, { status: 'failed', failureReason: reasonOf(e) });
    }
    await notifyFinished(runId);
    await cleanUp(runId, token);
    return 'finished';
  }
}

/**
 * Adds this part's count to the run's and writes the sum to the row; false when the row is no
 * longer the attempt's. The first mark of the time left is the first report of any part.
 */
async function reportPart(part: RunPartJobData, iterations: number, done: number): Promise<boolean> {
  const { runId, token } = part;
  const redis = redisConnection('queue');
  const now = Date.now();
  const doneKey = keyOf(runId, token, 'done');
  const firstKey = keyOf(runId, token, 'first');
  const replies = await redis
    .multi()
    .hset(doneKey, `${part.pass}:${part.from}`, done)
    .expire(doneKey, KEY_TTL_S)
    .hvals(doneKey)
    .set(firstKey, JSON.stringify({ at: now, done: 0 }), 'EX', KEY_TTL_S, 'NX')
    .get(firstKey)
    .exec();
  const sum = ((replies?.[2]?.[1] as string[]) ?? []).reduce((a, v) => a + Number(v), 0);
  const first = JSON.parse(String(replies?.[4]?.[1] ?? JSON.stringify({ at: now, done: 0 })));
  return writeSplitProgress(runId, token, iterations, sum, first);
}

/**
 * Computes one part: a pass of the bounded form over its chunks, block by block, yielding between
 * blocks (so the job's lock is renewed and a cancel gets through). Null when the run was
 * cancelled or is no longer this attempt's: the parent then ends without a result.
 */
export async function processPart(
  job: Job<RunPartJobData>,
  signal: AbortSignal,
): Promise<FirstPassPart | SecondPassPart | null> {
  const part = job.data;
  const held = await heldRun(part.runId, part.token);
  if (!held) return null;
  let fold: FirstPassFold | SecondPassFold;
  if (part.pass === 1) fold = new FirstPassFold(held.run, part.from, part.to);
  else {
    const stored = await redisConnection('queue').get(keyOf(part.runId, part.token, 'request'));
    if (!stored) throw new Error(`run ${part.runId}: the second pass's request is gone from Redis`);
    fold = new SecondPassFold(held.run, JSON.parse(stored) as SecondPassRequest, part.from, part.to);
  }
  const iterations = held.settings.iterations;
  let done = 0;
  let last = 0;
  for (const b of fold.blocks()) {
    if (signal.aborted) return null;
    done += fold.addBlock(b);
    if (Date.now() - last >= PART_PROGRESS_MS) {
      last = Date.now();
      if (!(await reportPart(part, iterations, done))) return null;
    }
    await yieldToEventLoop();
  }
  if (signal.aborted) return null;
  await reportPart(part, iterations, done);
  return fold.finish();
}

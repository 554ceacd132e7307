import 'server-only';
/**
 * Fields that every log line written while handling one request carries (its request id),
 * wherever in the call the line is written: a service logging a failed payment call need not
 * be handed a logger. Node's AsyncLocalStorage follows the request through every await.
 */
import { AsyncLocalStorage } from 'node:async_hooks';

export type LogContext = Readonly<Record<string, string | number>>;

// One store per process, whichever bundle loads this module.
const holder = globalThis as unknown as { outturnLogContext?: AsyncLocalStorage<LogContext> };
const storage: AsyncLocalStorage<LogContext> = (holder.outturnLogContext ??= new AsyncLocalStorage());

/** Runs `fn` with `fields` added to every log line it causes. */
export function withLogContext<T>(fields: LogContext, fn: () => T): T {
  return storage.run({ ...storage.getStore(), ...fields }, fn);
}

/** The fields of the request being handled, if any. */
export function currentLogContext(): LogContext | undefined {
  return storage.getStore();
}

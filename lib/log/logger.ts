import 'server-only';
/**
 * The server's one logger: JSON lines on stdout (one object per line, for a log shipper to
 * read), at the level LOG_LEVEL names (default info). Children add context fields: the request
 * id of an API request, the id of a run, the part of the server that speaks.
 */
import pino, { type Logger } from 'pino';
import { z } from 'zod';
import { currentLogContext } from './context';

const LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;
const levelSchema = z.enum(LEVELS);

/** LOG_LEVEL, or info when it is unset; an unknown level is reported once and info is used. */
export function logLevel(value: string | undefined): (typeof LEVELS)[number] {
  const trimmed = value?.trim().toLowerCase();
  if (!trimmed) return 'info';
  const parsed = levelSchema.safeParse(trimmed);
  return parsed.success ? parsed.data : 'info';
}

/** The logger's settings; `destination` (default stdout) for tests. */
export function createLogger(destination?: pino.DestinationStream): Logger {
  const options: pino.LoggerOptions = {
    level: logLevel(process.env.LOG_LEVEL),
    base: { pid: process.pid, service: process.env.OUTTURN_SERVICE ?? 'outturn' },
    timestamp: pino.stdTimeFunctions.isoTime,
    // "level":"info" rather than pino's number: readable without a lookup table.
    formatters: { level: (label) => ({ level: label }) },
    // The request's fields (lib/log/context.ts), unless the logger is a child already bound to them.
    mixin: (_object, _level, instance) => {
      const context = currentLogContext();
      if (!context) return {};
      const bound = instance.bindings();
      return Object.fromEntries(Object.entries(context).filter(([key]) => !(key in bound)));
    },
    // A context object that carries one of these by mistake never prints it.
    redact: {
      paths: [
        'password',
        '*.password',
        'token',
        '*.token',
        'cookie',
        '*.cookie',
        'authorization',
        '*.authorization',
      ],
      censor: '[hidden]',
    },
  };
  const logger = destination ? pino(options, destination) : pino(options);
  const raw = process.env.LOG_LEVEL?.trim();
  if (raw && logLevel(raw) !== raw.toLowerCase()) {
    logger.warn({ LOG_LEVEL: raw }, `LOG_LEVEL ${raw} is not one of ${LEVELS.join(', ')}: logging at info.`);
  }
  return logger;
}

// Next.js may load this module in more than one bundle of one process: one logger for all.
const holder = globalThis as unknown as { outturnLogger?: Logger };
export const log: Logger = (holder.outturnLogger ??= createLogger());

/** A logger whose every line names the part of the server that speaks ('mail', 'shutdown'…). */
export const componentLogger = (component: string): Logger => log.child({ component });

/** A logger whose every line carries the run's id, for everything that concerns one run. */
export const runLogger = (runId: number): Logger => log.child({ runId });

/** A logger whose every line carries the API request's id. */
export const requestLogger = (requestId: string): Logger => log.child({ requestId });

// What an unexpected error may put in the server log: its name, code, message, SQL text and
// stack frames, never the values bound to the statement (password hashes, tokens, e-mail
// addresses).
import type { Logger } from 'pino';

export type LoggedError = {
  name: string;
  message: string;
  code?: string;
  sql?: string;
  stack?: string;
  cause?: LoggedError;
};

// Quoted literals inside SQL text ('…' with '' or \' escapes) are values too: they go.
const SQL_LITERAL = /'(?:[^'\\]|\\.|'')*'/g;
// The MariaDB driver appends " - parameters:[…]" to its messages when logParam is on.
const DRIVER_PARAMETERS = /\s*-\s*parameters:\s*\[[\s\S]*$/;
const FRAME = /^\s+at /;

function scrub(text: string): string {
  return text.replace(DRIVER_PARAMETERS, '').replace(SQL_LITERAL, "'…'");
}

/** The stack's frames under the scrubbed first line: the raw stack repeats the raw message. */
function scrubbedStack(e: Error, message: string): string | undefined {
  if (typeof e.stack !== 'string') return undefined;
  const frames = e.stack.split('\n').filter((line) => FRAME.test(line));
  return [`${e.name}: ${message}`, ...frames].join('\n');
}

export function describeError(error: unknown, depth = 0, withStack = false): LoggedError {
  if (!(error instanceof Error)) return { name: typeof error, message: scrub(String(error)) };
  const e = error as Error & { code?: unknown; sql?: unknown; parent?: unknown; original?: unknown };
  const described: LoggedError = { name: e.name, message: scrub(e.message) };
  if (typeof e.code === 'string') described.code = e.code;
  if (typeof e.sql === 'string') described.sql = scrub(e.sql);
  if (withStack) described.stack = scrubbedStack(e, described.message);
  const inner = e.parent ?? e.original ?? e.cause;
  if (inner && inner !== error && depth < 3) described.cause = describeError(inner, depth + 1);
  return described;
}

/** Logs an error nobody expected, with its stack, on the given (request's, run's…) logger. */
export function logUnexpected(logger: Logger, what: string, error: unknown, fields: object = {}): void {
  logger.error({ ...fields, error: describeError(error, 0, true) }, what);
}

// What an unexpected error may put in the server log: its name, code, message and SQL text,
// never the values bound to the statement (password hashes, tokens, e-mail addresses).

export type LoggedError = { name: string; message: string; code?: string; sql?: string; cause?: LoggedError };

// Quoted literals inside SQL text ('…' with '' or \' escapes) are values too: they go.
const SQL_LITERAL = /'(?:[^'\\]|\\.|'')*'/g;
// The MariaDB driver appends " - parameters:[…]" to its messages when logParam is on.
const DRIVER_PARAMETERS = /\s*-\s*parameters:\s*\[[\s\S]*$/;

function scrub(text: string): string {
  return text.replace(DRIVER_PARAMETERS, '').replace(SQL_LITERAL, "'…'");
}

export function describeError(error: unknown, depth = 0): LoggedError {
  if (!(error instanceof Error)) return { name: typeof error, message: scrub(String(error)) };
  const e = error as Error & { code?: unknown; sql?: unknown; parent?: unknown; original?: unknown };
  const described: LoggedError = { name: e.name, message: scrub(e.message) };
  if (typeof e.code === 'string') described.code = e.code;
  if (typeof e.sql === 'string') described.sql = scrub(e.sql);
  const inner = e.parent ?? e.original ?? e.cause;
  if (inner && inner !== error && depth < 3) described.cause = describeError(inner, depth + 1);
  return described;
}

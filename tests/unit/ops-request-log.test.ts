// The request id, the route wrapper's echo of it, the paths and errors as the log keeps them,
// and the log level read from the environment.
import { describe, expect, it } from 'vitest';
import { isSaneRequestId, requestIdFrom, REQUEST_ID_HEADER } from '@/lib/log/request-id';
import { createLogger, logLevel } from '@/lib/log/logger';
import { withLogContext } from '@/lib/log/context';
import { loggablePath } from '@/lib/http/loggable-path';
import { describeError } from '@/lib/http/log-error';
import { handle } from '@/lib/http/route';
import { notFound } from '@/lib/errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
const withId = (id: string | null) => new Headers(id === null ? {} : { [REQUEST_ID_HEADER]: id });

describe('the request id', () => {
  it('keeps a caller’s plain token: UUIDs, hex trace ids, dotted and colon forms', () => {
    for (const id of [
      '3f2c1a9e-8b7d-4c6e-9f01-23456789abcd',
      '4bf92f3577b34da6a3ce929d0e0e4736',
      'lb.01:req-42',
    ])
      expect(requestIdFrom(withId(id))).toBe(id);
  });

  it('replaces anything that could forge or flood a log line with a new random UUID', () => {
    // A line break cannot even reach a Headers object; the check refuses it all the same.
    expect(isSaneRequestId('line\nbreak')).toBe(false);
    const bad = ['', ' ', 'two words', '"quoted"', '{"level":"fatal"}', 'x'.repeat(129), 'é'];
    for (const id of bad) {
      expect(isSaneRequestId(id)).toBe(false);
      expect(requestIdFrom(withId(id))).toMatch(UUID);
    }
    expect(requestIdFrom(withId(null))).toMatch(UUID);
    // Two requests without an id never share one.
    expect(requestIdFrom(withId(null))).not.toBe(requestIdFrom(withId(null)));
  });
});

describe('the route wrapper', () => {
  const ok = handle(async (_request: Request) => Response.json({ fine: true }));
  const missing = handle(async (_request: Request) => {
    throw notFound('Project');
  });

  it('echoes the request’s id on a success and on a typed error', async () => {
    const request = new Request('http://app.test/api/projects/7', {
      headers: { [REQUEST_ID_HEADER]: 'abc-123' },
    });
    const fine = await ok(request);
    expect(fine.status).toBe(200);
    expect(fine.headers.get(REQUEST_ID_HEADER)).toBe('abc-123');
    const gone = await missing(
      new Request('http://app.test/api/projects/8', { headers: { [REQUEST_ID_HEADER]: 'def-456' } }),
    );
    expect(gone.status).toBe(404);
    expect(gone.headers.get(REQUEST_ID_HEADER)).toBe('def-456');
  });

  it('gives a request without a sane id a new one, and hides an unexpected error behind a 500', async () => {
    const broken = handle(async (_request: Request) => {
      throw new Error("boom near 'secret'");
    });
    const res = await broken(
      new Request('http://app.test/api/x', { headers: { [REQUEST_ID_HEADER]: 'a b' } }),
    );
    expect(res.status).toBe(500);
    expect(res.headers.get(REQUEST_ID_HEADER)).toMatch(UUID);
    expect(await res.text()).not.toContain('secret');
  });
});

describe('what the log keeps of a path', () => {
  it('hides the secret tokens of invitation and reset links, and keeps ids and route words', () => {
    // The same shape as the tokens the app makes: crypto.randomBytes(24 or 32).toString('base64url').
    expect(loggablePath('/api/password-reset/Zm9vYmFyYmF6cXV4cXV1eGNvcmdlZ3JhdWx0Z2FycGx5')).toBe(
      '/api/password-reset/:token',
    );
    expect(loggablePath('/api/invitations/accept/q-7_Rk2ZpLmN0bXl0b2tlbjEyMzQ1Njc4')).toBe(
      '/api/invitations/accept/:token',
    );
    expect(loggablePath('/api/projects/12/runs/345/sample')).toBe('/api/projects/12/runs/345/sample');
    expect(loggablePath('/api/projects/12/correlations/9')).toBe('/api/projects/12/correlations/9');
  });
});

describe('an unexpected error’s stack', () => {
  it('keeps the frames and scrubs the first line as the message is scrubbed', () => {
    const error = new Error("Duplicate entry 'x@y.example' for key 'email' - parameters:['$2b$10$abc']");
    const logged = describeError(error, 0, true);
    expect(logged.stack).toBeDefined();
    expect(logged.stack).not.toContain('x@y.example');
    expect(logged.stack).not.toContain('$2b$10$');
    const lines = logged.stack!.split('\n');
    expect(lines[0]).toBe("Error: Duplicate entry '…' for key '…'");
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.slice(1).every((l) => /^\s+at /.test(l))).toBe(true);
    // Without asking, no stack (what the route's 500 reply is built from never carries one).
    expect(describeError(error)).not.toHaveProperty('stack');
  });
});

describe('LOG_LEVEL', () => {
  it('reads pino’s level names in any case, and falls back to info when unset or unknown', () => {
    expect(logLevel(undefined)).toBe('info');
    expect(logLevel('')).toBe('info');
    expect(logLevel('DEBUG')).toBe('debug');
    expect(logLevel(' warn ')).toBe('warn');
    expect(logLevel('silent')).toBe('silent');
    expect(logLevel('verbose')).toBe('info');
  });
});

describe('the log lines', () => {
  /** A logger writing into an array, one raw JSON line per entry. */
  function capture() {
    const lines: string[] = [];
    const logger = createLogger({ write: (line: string) => void lines.push(line) });
    return { logger, lines, parsed: () => lines.map((l) => JSON.parse(l) as Record<string, unknown>) };
  }

  it('are one JSON object per line, with the level’s name, an ISO time and the message', () => {
    const { logger, lines, parsed } = capture();
    logger.info({ runId: 7 }, 'run started');
    expect(lines).toHaveLength(1);
    expect(lines[0].endsWith('\n')).toBe(true);
    expect(parsed()[0]).toMatchObject({ level: 'info', runId: 7, msg: 'run started', service: 'outturn' });
    expect(new Date(String(parsed()[0].time)).toISOString()).toBe(parsed()[0].time);
  });

  it('carry the request’s id from anywhere inside the request, once even through a bound child', async () => {
    const { logger, lines, parsed } = capture();
    await withLogContext({ requestId: 'req-1' }, async () => {
      await Promise.resolve();
      logger.warn('deep in a service');
      logger.child({ requestId: 'req-1', component: 'mail' }).info('bound child');
    });
    logger.info('outside any request');
    expect(parsed().map((l) => l.requestId)).toEqual(['req-1', 'req-1', undefined]);
    expect(lines[1].match(/"requestId"/g)).toHaveLength(1);
  });

  it('never print a password, token, cookie or authorization value given by mistake', () => {
    const { logger, lines } = capture();
    logger.info(
      { password: 'hunter2', user: { token: 'abc123def', cookie: 'sid=1' }, authorization: 'Bearer x' },
      'oops',
    );
    expect(lines[0]).not.toMatch(/hunter2|abc123def|sid=1|Bearer x/);
    expect(lines[0]).toContain('[hidden]');
  });
});

import { NextResponse } from 'next/server';
import type { Logger } from 'pino';
import { AppError, badRequest, forbidden, isAppError } from '@/lib/errors';
import { requestLogger } from '@/lib/log/logger';
import { withLogContext } from '@/lib/log/context';
import { REQUEST_ID_HEADER, requestIdFrom } from '@/lib/log/request-id';
import { logUnexpected } from './log-error';
import { loggablePath } from './loggable-path';
import { isForeignOrigin, ORIGIN_EXEMPT_PATHS } from './origin';

/** Maps a thrown error to a JSON reply; unexpected errors are logged and never shown. */
export function errorResponse(error: unknown, logger: Logger): NextResponse {
  if (isAppError(error)) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, issues: error.issues, details: error.details } },
      { status: error.status },
    );
  }
  logUnexpected(logger, 'Unexpected error in a route', error);
  return NextResponse.json(
    { error: { code: 'internal', message: 'Something went wrong on our side. Nothing was changed.' } },
    { status: 500 },
  );
}

/** 403 for a state-changing request that a page of another origin sent. */
function assertSameOrigin(request: unknown) {
  if (!(request instanceof Request)) return;
  if (ORIGIN_EXEMPT_PATHS.has(new URL(request.url).pathname)) return;
  const { headers } = request;
  if (isForeignOrigin(request.method, headers.get('origin'), headers.get('host'))) {
    throw forbidden('Requests from another origin are refused.');
  }
}

export type HandleOptions = {
  /** Log successful replies at debug rather than info (a balancer's health probe every few seconds). */
  quiet?: boolean;
};

/**
 * Wraps a route handler so that every typed error becomes its status code, and every request
 * leaves one log line: method, path, status, duration and the request's id (set by proxy.ts,
 * or made here for the routes the proxy leaves out), which the reply echoes.
 */
export function handle<Args extends unknown[]>(
  fn: (...args: Args) => Promise<Response>,
  options: HandleOptions = {},
) {
  return async (...args: Args): Promise<Response> => {
    const started = performance.now();
    const request = args[0] instanceof Request ? args[0] : null;
    const requestId = request ? requestIdFrom(request.headers) : crypto.randomUUID();
    const logger = requestLogger(requestId);
    let response: Response;
    try {
      assertSameOrigin(request);
      // Every line logged while the handler runs, however deep, carries the request's id.
      response = await withLogContext({ requestId }, () => fn(...args));
    } catch (error) {
      response = errorResponse(error, logger);
    }
    if (!response.headers.has(REQUEST_ID_HEADER)) {
      try {
        response.headers.set(REQUEST_ID_HEADER, requestId);
      } catch {
        // A response with immutable headers (a redirect made by Response.redirect) goes as it is.
      }
    }
    const line = {
      method: request?.method,
      path: request ? loggablePath(new URL(request.url).pathname) : undefined,
      status: response.status,
      ms: Math.round(performance.now() - started),
    };
    const level =
      response.status >= 500 ? 'error' : options.quiet && response.status < 400 ? 'debug' : 'info';
    logger[level](line, 'request');
    return response;
  };
}

const unsupportedMediaType = (message: string) => new AppError(415, 'unsupported_media_type', message);

/**
 * Reads a JSON body: 415 unless it is sent as application/json (a foreign page can post
 * text/plain without asking the browser's permission, never application/json), 400 when it
 * does not parse.
 */
export async function readJson(request: Request): Promise<unknown> {
  const type = request.headers.get('content-type')?.split(';')[0]?.trim().toLowerCase();
  if (type !== 'application/json') {
    throw unsupportedMediaType('Send the request body as JSON, with Content-Type: application/json.');
  }
  try {
    return await request.json();
  } catch {
    throw badRequest('The request body must be JSON.');
  }
}

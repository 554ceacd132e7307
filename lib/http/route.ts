import { NextResponse } from 'next/server';
import { AppError, badRequest, forbidden, isAppError } from '@/lib/errors';
import { describeError } from './log-error';
import { isForeignOrigin, ORIGIN_EXEMPT_PATHS } from './origin';

/** Maps a thrown error to a JSON reply; unexpected errors are logged and never shown. */
export function errorResponse(error: unknown): NextResponse {
  if (isAppError(error)) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, issues: error.issues, details: error.details } },
      { status: error.status },
    );
  }
  console.error('Unexpected error in a route:', describeError(error));
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

/** Wraps a route handler so that every typed error becomes its status code. */
export function handle<Args extends unknown[]>(fn: (...args: Args) => Promise<Response>) {
  return async (...args: Args): Promise<Response> => {
    try {
      assertSameOrigin(args[0]);
      return await fn(...args);
    } catch (error) {
      return errorResponse(error);
    }
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

import { NextResponse } from 'next/server';
import { badRequest, isAppError } from '@/lib/errors';

/** Maps a thrown error to a JSON reply; unexpected errors are logged and never shown. */
export function errorResponse(error: unknown): NextResponse {
  if (isAppError(error)) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, issues: error.issues, details: error.details } },
      { status: error.status },
    );
  }
  console.error(error);
  return NextResponse.json(
    { error: { code: 'internal', message: 'Something went wrong on our side. Nothing was changed.' } },
    { status: 500 },
  );
}

/** Wraps a route handler so that every typed error becomes its status code. */
export function handle<Args extends unknown[]>(fn: (...args: Args) => Promise<Response>) {
  return async (...args: Args): Promise<Response> => {
    try {
      return await fn(...args);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Reads a JSON body, answering 400 when it is not JSON. */
export async function readJson(request: Request): Promise<unknown> {
  try {
    return await request.json();
  } catch {
    throw badRequest('The request body must be JSON.');
  }
}

import type { FieldIssue } from '@/lib/errors';

export type ApiFailure = { status: number; message: string; issues: FieldIssue[]; details?: unknown };

export class ApiError extends Error {
  constructor(readonly failure: ApiFailure) {
    super(failure.message);
  }
}

/** Calls one of our route handlers with JSON and throws ApiError with the server's message. */
export async function callApi<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const response = await fetch(url, {
    method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
    headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  const text = await response.text();
  const json = text ? JSON.parse(text) : null;
  if (!response.ok) {
    throw new ApiError({
      status: response.status,
      message: json?.error?.message ?? `The server answered ${response.status}.`,
      issues: json?.error?.issues ?? [],
      details: json?.error?.details,
    });
  }
  return json as T;
}

/** The server's reason for a failed call, or `fallback` when the server was not reached. */
export function failureMessage(error: unknown, fallback = 'The server could not be reached.'): string {
  return error instanceof ApiError ? error.failure.message : fallback;
}

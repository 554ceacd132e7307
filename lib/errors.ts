// Typed errors that services throw and the route/page guard maps to status codes.
// Database and internal details never reach the client: only `message` and `issues`.

export type FieldIssue = { path: string; message: string };

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: FieldIssue[],
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') =>
  new AppError(403, 'forbidden', message);
export const notFound = (what = 'Record') => new AppError(404, 'not_found', `${what} not found.`);
export const badRequest = (message: string, issues?: FieldIssue[]) =>
  new AppError(400, 'bad_request', message, issues);
export const conflict = (message: string, details?: unknown) =>
  new AppError(409, 'conflict', message, undefined, details);
export const tooMany = (message: string) => new AppError(429, 'rate_limited', message);
export const paymentRequired = (message: string, details?: unknown) =>
  new AppError(402, 'read_only', message, undefined, details);
export const tooLarge = (message: string) => new AppError(413, 'too_large', message);
export const badGateway = (message: string) => new AppError(502, 'payments_unavailable', message);

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

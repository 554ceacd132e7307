import type { z } from 'zod';
import { badRequest, type FieldIssue } from '@/lib/errors';

/** Turns zod issues into `{ path, message }` pairs that name the field. */
export function toFieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(input)',
    message: issue.message,
  }));
}

/** Parses input with a schema or throws a 400 that lists every bad field. */
export function parseOrThrow<T extends z.ZodType>(schema: T, input: unknown): z.infer<T> {
  const result = schema.safeParse(input);
  if (!result.success) {
    const issues = toFieldIssues(result.error);
    throw badRequest(issues.map((i) => `${i.path}: ${i.message}`).join('; '), issues);
  }
  return result.data;
}

import { notFound } from '@/lib/errors';

/** A numeric id from the URL; anything else is "not found" (never a 500). */
export function idParam(value: string | undefined, what = 'Record'): number {
  const id = Number(value);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound(what);
  return id;
}

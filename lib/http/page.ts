import { notFound } from 'next/navigation';
import { isAppError } from '@/lib/errors';

/**
 * Runs a page's lookup and turns a typed 404 (another organisation's record, an unknown id, a
 * malformed id from `idParam`) into the not-found page. Call it before any loading state has been
 * sent (in a layout, or in a page without a loading.tsx above it), so that the answer carries a
 * real 404 status.
 */
export async function loadOrNotFound<T>(load: () => Promise<T>): Promise<T> {
  try {
    return await load();
  } catch (e) {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  }
}

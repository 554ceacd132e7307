import { describe, expect, it } from 'vitest';
import { conflict, notFound } from '@/lib/errors';
import { idParam } from '@/lib/http/params';
import { loadOrNotFound } from '@/lib/http/page';

// Next.js marks the error that notFound() throws with this digest; it renders the not-found page
// with a 404 status when it is thrown before streaming starts.
const NOT_FOUND_DIGEST = 'NEXT_HTTP_ERROR_FALLBACK;404';

describe('loadOrNotFound', () => {
  it('returns what the lookup found', async () => {
    expect(await loadOrNotFound(async () => ({ id: 7 }))).toEqual({ id: 7 });
  });

  it("turns a service's 404 into the not-found page", async () => {
    const error = await loadOrNotFound(async () => {
      throw notFound('Project');
    }).catch((e: unknown) => e);
    expect((error as { digest?: string }).digest).toBe(NOT_FOUND_DIGEST);
  });

  it('turns a malformed id into the not-found page, as route handlers answer 404', async () => {
    for (const raw of ['abc', '12abc', '0', '-3', '1.5', undefined]) {
      const error = await loadOrNotFound(async () => idParam(raw, 'Run')).catch((e: unknown) => e);
      expect((error as { digest?: string }).digest, String(raw)).toBe(NOT_FOUND_DIGEST);
    }
  });

  it('lets every other error through unchanged', async () => {
    const stale = conflict('Only finished runs can be compared.');
    await expect(
      loadOrNotFound(async () => {
        throw stale;
      }),
    ).rejects.toBe(stale);
  });
});

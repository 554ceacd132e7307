// Rows that are not saved yet (new rows still being filled in, values the register refused)
// kept in the browser's storage, per user, project and register, so that a reload, a tab
// change or a closed window loses none of them. Nothing here is sent to the server.

import type { RegisterKind } from '@/lib/validation/registers';

export type Draft = { values: Record<string, unknown>; issues: Record<string, string>; isNew: boolean };
export type StoredDrafts = { drafts: [string, Draft][]; order: [string, number][] };

export type DraftScope = { userId: number; projectId: number; kind: RegisterKind };

const PREFIX = 'outturn.drafts.v1';

export function draftStorageKey({ userId, projectId, kind }: DraftScope): string {
  return `${PREFIX}:${userId}:${projectId}:${kind}`;
}

/** The drafts kept for a scope; nothing when storage is unavailable or holds something else. */
export function loadDrafts(scope: DraftScope): StoredDrafts {
  const empty: StoredDrafts = { drafts: [], order: [] };
  try {
    const raw = window.localStorage.getItem(draftStorageKey(scope));
    if (!raw) return empty;
    const parsed = JSON.parse(raw) as Partial<StoredDrafts>;
    if (!Array.isArray(parsed.drafts) || !Array.isArray(parsed.order)) return empty;
    return {
      drafts: parsed.drafts.filter(
        (d): d is [string, Draft] =>
          Array.isArray(d) && typeof d[0] === 'string' && typeof d[1]?.values === 'object',
      ),
      order: parsed.order.filter(
        (o): o is [string, number] => Array.isArray(o) && typeof o[0] === 'string' && Number.isFinite(o[1]),
      ),
    };
  } catch {
    return empty;
  }
}

/** Keeps the drafts of a scope (or forgets them when there are none). */
export function saveDrafts(scope: DraftScope, stored: StoredDrafts): void {
  try {
    const key = draftStorageKey(scope);
    if (!stored.drafts.length) window.localStorage.removeItem(key);
    else window.localStorage.setItem(key, JSON.stringify(stored));
  } catch {
    // Storage full or disabled: the drafts still live in the page until it is left.
  }
}

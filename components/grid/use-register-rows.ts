'use client';
// A register's rows on the client: TanStack Query for the saved rows, drafts for rows whose
// cells are not valid yet (never sent, kept in the browser per user and project), optimistic
// saves sent one after another, and the 409 flow: the other person's row replaces ours in the
// grid and our values are kept to re-apply.
//
// Saves go out one at a time and each names the version its rows will have when it arrives:
// a row this page saved a moment ago is at the version that save returned, not the one the
// edit was made on. Two quick edits of one row are two saves, never a conflict with oneself.

import { useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiError, callApi } from '@/components/forms/api';
import { rowIssues, type RegisterKind } from '@/lib/validation/registers';
import { registerQueryKey } from '@/lib/registers/query-key';
import { loadDrafts, saveDrafts, type Draft } from './draft-store';
import { useDraftOwner } from './draft-owner';
import { OwnVersions } from './own-versions';

export type SavedRow = Record<string, unknown> & {
  id: number;
  version: number;
  sortOrder: number;
  key?: string;
};
export type GridRow = Record<string, unknown> & {
  _key: string;
  _id: number | null;
  _version: number | null;
  _issues: Record<string, string>;
  _draft: boolean;
  /** The values this user tried to save when someone else had changed the row. */
  _mine?: Record<string, unknown>;
};

type Batch = {
  upserts: Record<string, unknown>[];
  deletes: { id: number; version: number }[];
  order?: (number | string)[];
};
/** A batch on its way, with the rows it deletes (put back when the server cannot be reached). */
type Sending = { batch: Batch; removed: SavedRow[] };
type BatchReply = { rows: SavedRow[]; deleted: number[]; cascaded: RegisterKind[] };

export type Notice = { tone: 'invalid' | 'caution' | 'success' | 'info'; text: string } | null;

const META = new Set(['id', 'version', 'sortOrder', 'key']);
export const rowKey = (r: SavedRow) => r.key ?? `r${r.id}`;
const dataOf = (r: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(r).filter(([k]) => !META.has(k) && !k.startsWith('_')));

let counter = 0;
export const newKey = () => `n${Date.now().toString(36)}${(counter++).toString(36)}`;

export { registerQueryKey };

const subscribeToNothing = () => () => {};
const isBrowser = () => true;
const isServer = () => false;

/** What the grid says about drafts kept from an earlier visit. */
function keptNotice(count: number): Notice {
  if (!count) return null;
  const one = count === 1;
  return {
    tone: 'caution',
    text: `${one ? 'One row' : `${count} rows`} not saved on your last visit ${one ? 'is' : 'are'} back in the grid (tinted amber). Finish ${one ? 'it' : 'them'} to save, or delete ${one ? 'it' : 'them'}.`,
  };
}

/** The register's rows as they are once the batch is applied (shown at once, before the reply). */
function applyOptimistic(previous: SavedRow[], batch: Batch): SavedRow[] {
  const deleted = new Set(batch.deletes.map((d) => d.id));
  const byId = new Map(batch.upserts.filter((u) => u.id).map((u) => [u.id as number, u]));
  return previous
    .filter((r) => !deleted.has(r.id))
    .map((r) => (byId.has(r.id) ? ({ ...r, ...byId.get(r.id), version: r.version } as SavedRow) : r));
}

export function useRegisterRows(
  projectId: number,
  kind: RegisterKind,
  extraIssues?: (values: Record<string, unknown>, all: Record<string, unknown>[]) => Record<string, string>,
) {
  const qc = useQueryClient();
  const queryKey = registerQueryKey(projectId, kind);
  const url = `/api/projects/${projectId}/${kind}`;
  const query = useQuery({
    queryKey,
    queryFn: async () => (await callApi<{ rows: SavedRow[] }>(url)).rows,
  });
  // Drafts kept from an earlier visit come back once the page has hydrated: the server sends
  // the saved rows with the page, and reading the browser's store during the first render would
  // make that render differ from the server's.
  const owner = useDraftOwner();
  const scope = useMemo(
    () => (owner === null ? null : { userId: owner, projectId, kind }),
    [owner, projectId, kind],
  );
  const [drafts, setDrafts] = useState<Map<string, Draft>>(() => new Map());
  const [mine, setMine] = useState<Map<string, Record<string, unknown>>>(new Map());
  const [newOrder, setNewOrder] = useState<Map<string, number>>(() => new Map());
  const [notice, setNotice] = useState<Notice>(null);
  // The scope whose stored drafts have been read: nothing is written back before they are.
  const [loadedScope, setLoadedScope] = useState<string | null>(null);
  const scopeKey = scope ? `${scope.userId}:${scope.projectId}:${scope.kind}` : null;
  // False while hydrating (the server's snapshot), true after: the store is read only then.
  const hydrated = useSyncExternalStore(subscribeToNothing, isBrowser, isServer);
  if (hydrated && scope && scopeKey && loadedScope !== scopeKey) {
    const kept = loadDrafts(scope);
    setLoadedScope(scopeKey);
    setDrafts(new Map(kept.drafts));
    setNewOrder(new Map(kept.order));
    setNotice(keptNotice(kept.drafts.length));
  }
  const [pending, setPending] = useState(0);
  const queue = useRef<Promise<unknown>>(Promise.resolve());
  const own = useRef(new OwnVersions());

  const saved = useMemo(() => query.data ?? [], [query.data]);

  // Every change of the drafts is kept; a draft of a row someone has since deleted is dropped.
  useEffect(() => {
    if (!scope || loadedScope !== scopeKey) return;
    const present = query.data ? new Set(query.data.map(rowKey)) : null;
    const live = [...drafts].filter(([key, d]) => d.isNew || !present || present.has(key));
    saveDrafts(scope, { drafts: live, order: [...newOrder].filter(([k]) => drafts.has(k)) });
  }, [scope, scopeKey, loadedScope, drafts, newOrder, query.data]);

  const issuesOf = useCallback(
    (values: Record<string, unknown>, all: Record<string, unknown>[]) => ({
      ...rowIssues(kind, values),
      ...(extraIssues?.(values, all) ?? {}),
    }),
    [kind, extraIssues],
  );

  const rows: GridRow[] = useMemo(() => {
    const out: GridRow[] = saved.map((r) => {
      const key = rowKey(r);
      const d = drafts.get(key);
      return {
        ...(d ? d.values : dataOf(r)),
        _key: key,
        _id: r.id,
        _version: r.version,
        _issues: d ? d.issues : {},
        _draft: Boolean(d),
        _mine: mine.get(key),
      };
    });
    // New rows not saved yet sit where they were inserted.
    const fresh = [...drafts.entries()].filter(([, d]) => d.isNew);
    for (const [key, d] of fresh.sort((a, b) => (newOrder.get(a[0]) ?? 1e9) - (newOrder.get(b[0]) ?? 1e9))) {
      const at = Math.min(newOrder.get(key) ?? out.length, out.length);
      out.splice(at, 0, {
        ...d.values,
        _key: key,
        _id: null,
        _version: null,
        _issues: d.issues,
        _draft: true,
      });
    }
    return out;
  }, [saved, drafts, mine, newOrder]);

  const mutation = useMutation({
    mutationFn: ({ batch }: Sending) => callApi<BatchReply>(url, { body: batch }),
    onError: (error, { batch, removed }) => {
      if (!(error instanceof ApiError)) {
        // The server was not reached: deleted rows come back and changed rows are kept as
        // drafts, so that nothing typed is lost.
        const current = qc.getQueryData<SavedRow[]>(queryKey) ?? [];
        const present = new Set(current.map((r) => r.id));
        qc.setQueryData(
          queryKey,
          [...current, ...removed.filter((r) => !present.has(r.id))].sort(
            (a, b) => a.sortOrder - b.sortOrder || a.id - b.id,
          ),
        );
        setDrafts((ds) => {
          const n = new Map(ds);
          for (const u of batch.upserts)
            n.set((u.key as string) ?? `r${u.id}`, { values: dataOf(u), issues: {}, isNew: !u.id });
          return n;
        });
        setNotice({
          tone: 'invalid',
          text: 'The change could not be saved (no connection?). It is kept in this browser, marked as not saved: edit the row again to save it.',
        });
        return;
      }
      // Nothing of the batch was saved: the server's rows are the truth again (saves queued
      // behind this one still go out).
      void qc.invalidateQueries({ queryKey });
      const f = error.failure;
      if (f.status === 409) {
        const conflicts =
          (f.details as { conflicts?: { id: number; current: SavedRow | null }[] })?.conflicts ?? [];
        const current = qc.getQueryData<SavedRow[]>(queryKey) ?? [];
        const gone = new Set(conflicts.filter((c) => !c.current).map((c) => c.id));
        const fresh = new Map(conflicts.filter((c) => c.current).map((c) => [c.id, c.current!]));
        qc.setQueryData(
          queryKey,
          current
            .filter((r) => !gone.has(r.id))
            .map((r) => (fresh.has(r.id) ? { ...fresh.get(r.id)!, key: r.key } : r)),
        );
        setMine((m) => {
          const n = new Map(m);
          for (const u of batch.upserts) {
            const row = current.find((r) => r.id === u.id);
            if (row && fresh.has(row.id)) n.set(rowKey(row), dataOf(u));
          }
          return n;
        });
        setNotice({ tone: 'caution', text: f.message });
        return;
      }
      // A refusal (400): the rows go back to being drafts, each cell saying why.
      if (f.status === 400 && f.issues.length) {
        setDrafts((ds) => {
          const n = new Map(ds);
          batch.upserts.forEach((u, i) => {
            const issues: Record<string, string> = {};
            for (const issue of f.issues) {
              const m = /^rows\[(\d+)\]\.(\w+)/.exec(issue.path);
              if (m && Number(m[1]) === i) issues[m[2]] ??= issue.message.replace(/^[^:]*?, \w+: /, '');
            }
            if (!Object.keys(issues).length) return;
            const key = (u.key as string) ?? `r${u.id}`;
            n.set(key, { values: dataOf(u), issues, isNew: !u.id });
          });
          return n;
        });
      }
      setNotice({ tone: 'invalid', text: f.message });
    },
    onSuccess: (reply, { batch }) => {
      const current = qc.getQueryData<SavedRow[]>(queryKey) ?? [];
      const byId = new Map(reply.rows.map((r) => [r.id, r]));
      for (const u of batch.upserts) {
        const row = typeof u.id === 'number' ? byId.get(u.id) : undefined;
        if (row && typeof u.version === 'number') own.current.saved(row.id, u.version, row.version);
      }
      const existing = new Set(current.map((r) => r.id));
      const keyOf = new Map(batch.upserts.filter((u) => u.key && !u.id).map((u) => [u.key as string, true]));
      let next = current
        .filter((r) => !reply.deleted.includes(r.id))
        .map((r) => (byId.has(r.id) ? { ...byId.get(r.id)!, key: r.key } : r));
      const created = reply.rows.filter((r) => !existing.has(r.id));
      next = [...next, ...created].sort((a, b) => a.sortOrder - b.sortOrder || a.id - b.id);
      qc.setQueryData(queryKey, next);
      if (created.length) {
        setDrafts((ds) => {
          const n = new Map(ds);
          for (const r of created) if (r.key && keyOf.has(r.key)) n.delete(r.key);
          return n;
        });
        setNewOrder((o) => {
          const n = new Map(o);
          for (const r of created) if (r.key) n.delete(r.key);
          return n;
        });
      }
      for (const k of reply.cascaded) qc.invalidateQueries({ queryKey: registerQueryKey(projectId, k) });
      setNotice(null);
    },
  });

  /**
   * Shows the batch at once and sends it after the saves before it. The rows it names are
   * read again at sending time, at the versions this page's own earlier saves gave them.
   */
  const { mutateAsync } = mutation;
  const enqueue = useCallback(
    (batch: Batch) => {
      const previous = qc.getQueryData<SavedRow[]>(queryKey) ?? [];
      const deleting = new Set(batch.deletes.map((d) => d.id));
      const removed = previous.filter((r) => deleting.has(r.id));
      qc.setQueryData(queryKey, applyOptimistic(previous, batch));
      setPending((n) => n + 1);
      queue.current = queue.current
        .then(async () => {
          await qc.cancelQueries({ queryKey });
          await mutateAsync({ batch: own.current.batch(batch), removed });
        })
        .catch(() => undefined)
        .finally(() => setPending((n) => n - 1));
    },
    [qc, queryKey, mutateAsync],
  );

  /** Applies cell values to rows: valid rows are saved in one batch, invalid ones stay drafts. */
  const applyValues = useCallback(
    (updates: { key: string; values: Record<string, unknown> }[], options: { order?: boolean } = {}) => {
      const allValues = rows.map((r) => dataOf(r));
      const byKey = new Map(rows.map((r) => [r._key, r]));
      const upserts: Record<string, unknown>[] = [];
      const nextDrafts = new Map(drafts);
      const merged = new Map<string, Record<string, unknown>>();
      for (const u of updates)
        merged.set(u.key, { ...(merged.get(u.key) ?? dataOf(byKey.get(u.key) ?? {})), ...u.values });
      const projected = allValues.map((v, i) => merged.get(rows[i]._key) ?? v);
      for (const [key, values] of merged) {
        const row = byKey.get(key);
        const issues = issuesOf(values, projected);
        if (Object.keys(issues).length) {
          nextDrafts.set(key, { values, issues, isNew: !row?._id });
          continue;
        }
        nextDrafts.delete(key);
        upserts.push(row?._id ? { ...values, id: row._id, version: row._version } : { ...values, key });
      }
      setDrafts(nextDrafts);
      // Values re-applied after a conflict are the user's again.
      setMine((m) => {
        if (!updates.some((u) => m.has(u.key))) return m;
        const n = new Map(m);
        for (const u of updates) n.delete(u.key);
        return n;
      });
      if (!upserts.length) {
        const invalid = updates.length - upserts.length;
        if (invalid)
          setNotice({
            tone: 'invalid',
            text: `Not saved: ${invalid === 1 ? 'the row has' : `${invalid} rows have`} a value that is not valid. The cell says why.`,
          });
        return;
      }
      const invalidCount = merged.size - upserts.length;
      if (invalidCount) {
        setNotice({
          tone: 'invalid',
          text: `${upserts.length} row${upserts.length === 1 ? '' : 's'} saved; ${invalidCount} not saved because a value is not valid (marked in red).`,
        });
      }
      const hasNew = upserts.some((u) => !u.id);
      enqueue({
        upserts,
        deletes: [],
        order: hasNew || options.order ? rows.map((r) => r._id ?? r._key) : undefined,
      });
    },
    [rows, drafts, issuesOf, enqueue],
  );

  const insertRow = useCallback(
    (at: number, values: Record<string, unknown>) => {
      const key = newKey();
      const issues = issuesOf(
        values,
        rows.map((r) => dataOf(r)),
      );
      setNewOrder((o) => new Map(o).set(key, at));
      setDrafts((d) => new Map(d).set(key, { values, issues, isNew: true }));
      return key;
    },
    [issuesOf, rows],
  );

  const deleteRows = useCallback(
    (keys: string[]) => {
      const chosen = rows.filter((r) => keys.includes(r._key));
      setDrafts((d) => {
        const n = new Map(d);
        for (const r of chosen) n.delete(r._key);
        return n;
      });
      const deletes = chosen.filter((r) => r._id).map((r) => ({ id: r._id!, version: r._version! }));
      if (deletes.length) enqueue({ upserts: [], deletes });
    },
    [rows, enqueue],
  );

  const moveRow = useCallback(
    (key: string, by: number) => {
      const i = rows.findIndex((r) => r._key === key);
      const j = i + by;
      if (i < 0 || j < 0 || j >= rows.length || !rows[i]._id || !rows[j]._id) return;
      const order = rows.map((r) => r._id ?? r._key);
      [order[i], order[j]] = [order[j], order[i]];
      const current = qc.getQueryData<SavedRow[]>(queryKey) ?? [];
      const pos = new Map(order.map((ref, k) => [ref, k]));
      qc.setQueryData(
        queryKey,
        current
          .map((r) => ({ ...r, sortOrder: pos.get(r.id) ?? r.sortOrder }))
          .sort((a, b) => a.sortOrder - b.sortOrder),
      );
      enqueue({ upserts: [], deletes: [], order });
    },
    [rows, enqueue, qc, queryKey],
  );

  /** Re-sends the user's own values over the other person's (now current) version. */
  const reapplyMine = useCallback(() => {
    const updates = [...mine.entries()].map(([key, values]) => ({ key, values }));
    setMine(new Map());
    applyValues(updates);
  }, [mine, applyValues]);

  const keepTheirs = useCallback(() => {
    setMine(new Map());
    setNotice(null);
  }, []);

  return {
    query,
    rows,
    applyValues,
    insertRow,
    deleteRows,
    moveRow,
    reapplyMine,
    keepTheirs,
    conflicts: mine.size,
    /** Rows in the grid that are not saved: new rows not finished, values the register refused. */
    unsaved: rows.filter((r) => r._draft).length,
    notice,
    setNotice,
    saving: pending > 0,
  };
}

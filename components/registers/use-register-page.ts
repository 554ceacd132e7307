'use client';
// Glue shared by the register tabs: the rows hook, selection, focus and the toolbar actions.
import { useCallback, useRef, useState } from 'react';
import type { RegisterKind } from '@/lib/validation/registers';
import { useQuery } from '@tanstack/react-query';
import { callApi } from '@/components/forms/api';
import {
  registerQueryKey,
  useRegisterRows,
  type GridRow,
  type SavedRow,
} from '@/components/grid/use-register-rows';

export function useRegisterPage(
  projectId: number,
  kind: RegisterKind,
  blank: (rows: number) => Record<string, unknown>,
  extraIssues?: Parameters<typeof useRegisterRows>[2],
) {
  const register = useRegisterRows(projectId, kind, extraIssues);
  const [selected, setSelected] = useState<string[]>([]);
  const focused = useRef<string | null>(null);

  const add = useCallback(
    () => register.insertRow(register.rows.length, blank(register.rows.length)),
    [register, blank],
  );
  const insert = useCallback(() => {
    const at = Math.max(
      0,
      register.rows.findIndex((r) => r._key === focused.current),
    );
    register.insertRow(at, blank(at));
  }, [register, blank]);
  const addRows = useCallback(
    (count: number, at: number) => Array.from({ length: count }, (_, i) => register.insertRow(at + i, {})),
    [register],
  );
  const remove = useCallback(() => {
    if (selected.length > 20 && !window.confirm(`Delete ${selected.length} rows? This is saved at once.`))
      return;
    register.deleteRows(selected);
    setSelected([]);
  }, [register, selected]);
  const move = useCallback(
    (by: number) => focused.current && register.moveRow(focused.current, by),
    [register],
  );
  const onFocusRow = useCallback((key: string | null) => (focused.current = key), []);

  return {
    projectId,
    kind,
    register,
    blank,
    selected,
    setSelected,
    add,
    insert,
    addRows,
    remove,
    move,
    onFocusRow,
  };
}

export type RegisterPage = ReturnType<typeof useRegisterPage>;

/** Another register's saved rows, read for reference (e.g. the activity codes on the line items). */
export function useSavedRows(projectId: number, kind: RegisterKind) {
  return useQuery({
    queryKey: registerQueryKey(projectId, kind),
    queryFn: async () => (await callApi<{ rows: SavedRow[] }>(`/api/projects/${projectId}/${kind}`)).rows,
  });
}

/** The issue of a code that another row of the register uses as well. */
export function duplicateCodeIssue(
  values: Record<string, unknown>,
  all: Record<string, unknown>[],
  noun: string,
): string | null {
  if (!values.code || all.filter((r) => r.code === values.code).length < 2) return null;
  return `${String(values.code)} is used by another ${noun}.`;
}

/** A read-only row below the grid's rows holding the register's totals. */
export function totalRowOf(values: Record<string, unknown>): GridRow {
  return { ...values, _key: 'total', _issues: {}, _draft: false, _id: null, _version: null } as GridRow;
}

/** The next code in a sequence: after "C12" comes "C13"; after "2.3" comes "2.4". */
export function nextCode(codes: string[], fallback: string): string {
  const last = [...codes].reverse().find((c) => /\d+$/.test(c));
  if (!last) return fallback;
  const m = /^(.*?)(\d+)$/.exec(last)!;
  let n = Number(m[2]) + 1;
  const taken = new Set(codes);
  while (taken.has(`${m[1]}${n}`)) n++;
  return `${m[1]}${String(n).padStart(m[2].length, '0')}`;
}

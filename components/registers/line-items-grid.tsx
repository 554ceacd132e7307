'use client';
// The line items register: WBS lines with their distributions, computed mean and P10–P90 as
// you type, a total row with the base estimate, and lines indented by WBS level.

import { useCallback, useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { callApi } from '@/components/forms/api';
import { RegisterGrid } from '@/components/grid/register-grid';
import type { RegisterColumn } from '@/components/grid/columns';
import { registerQueryKey, type GridRow, type SavedRow } from '@/components/grid/use-register-rows';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { activityBaseDurations, lineBase } from '@/lib/registers/base-estimate';
import { meanOf, specFromParts, summarise, type DistType } from '@/lib/registers/dist-fields';
import { formatMoney } from '@/lib/registers/numbers';
import { wbsLevel } from '@/lib/registers/wbs';
import { distColumns } from './dist-columns';
import { RegisterNotice } from './register-notice';
import { RegisterToolbar } from './register-toolbar';
import { ImportExport } from './import-export';
import { nextCode, useRegisterPage } from './use-register-page';

type Summary = { mean: number | null; p10: number | null; p90: number | null };

/** The line's mean without its percentiles (for the total row). */
function lineMean(row: GridRow, meanDays: Map<string, number>): number | null {
  const type = row.distType as DistType | null;
  if (!type) return typeof row.base === 'number' ? row.base : null;
  const r = specFromParts({ ...(row as object), type } as never);
  if (!r.ok) return null;
  if (row.basis !== 'per-day') return meanOf(r.spec);
  const days = meanDays.get(String(row.activityCode ?? ''));
  return days === undefined ? null : meanOf(r.spec) * days;
}

function lineSummary(row: GridRow, meanDays: Map<string, number>): Summary {
  const type = row.distType as DistType | null;
  if (!type) return { mean: typeof row.base === 'number' ? row.base : null, p10: null, p90: null };
  const r = specFromParts({ ...(row as object), type } as never);
  if (!r.ok) return { mean: null, p10: null, p90: null };
  const s = summarise(r.spec);
  if (row.basis === 'per-day') {
    // E[rate × days] = E[rate]·E[days] for independent inputs; the spread depends on the schedule.
    const days = meanDays.get(String(row.activityCode ?? ''));
    return { mean: days === undefined ? null : s.mean * days, p10: null, p90: null };
  }
  return s;
}

export function LineItemsGrid({
  projectId,
  currency,
  readOnly,
}: {
  projectId: number;
  currency: string;
  readOnly: boolean;
}) {
  const activities = useQuery({
    queryKey: registerQueryKey(projectId, 'activities'),
    queryFn: async () => (await callApi<{ rows: SavedRow[] }>(`/api/projects/${projectId}/activities`)).rows,
  });
  const activityCodes = useMemo(
    () => new Set((activities.data ?? []).map((a) => String(a.code))),
    [activities.data],
  );
  const extraIssues = useCallback(
    (v: Record<string, unknown>, all: Record<string, unknown>[]) => {
      const out: Record<string, string> = {};
      if (
        v.basis === 'per-day' &&
        v.activityCode &&
        activities.data &&
        !activityCodes.has(String(v.activityCode))
      ) {
        out.activityCode = `Unknown activity "${v.activityCode}": add it on the Schedule tab first.`;
      }
      if (v.code && all.filter((r) => r.code === v.code).length > 1)
        out.code = `${v.code} is used by another line.`;
      return out;
    },
    [activities.data, activityCodes],
  );
  const blank = useCallback(
    (_at: number) => ({
      code: '',
      description: '',
      basis: 'lump-sum',
      distType: 'triangular',
      range: 'min-max',
    }),
    [],
  );
  const page = useRegisterPage(projectId, 'items', blank, extraIssues);
  const { register } = page;

  const durations = useMemo(() => {
    const rows = (activities.data ?? []) as never[];
    const base = activityBaseDurations(rows);
    const mean = new Map<string, number>();
    for (const a of activities.data ?? []) {
      const r = specFromParts({ ...(a as object), type: a.distType } as never);
      if (r.ok) mean.set(String(a.code), summarise(r.spec).mean);
    }
    return { base, mean };
  }, [activities.data]);

  // summarise() is memoised by parameters, so this stays cheap for 2,000 rows.
  const summaries = useCallback((row: GridRow) => lineSummary(row, durations.mean), [durations]);

  const money = useCallback(
    (v: unknown) => (typeof v === 'number' ? formatMoney(v) : v == null ? '' : String(v)),
    [],
  );

  const columns = useMemo<RegisterColumn[]>(
    () => [
      {
        field: 'code',
        header: 'WBS',
        kind: 'text',
        width: 110,
        pinned: 'left',
        indent: (r) => wbsLevel(String(r.code ?? '')),
      },
      { field: 'description', header: 'Description', kind: 'text', width: 230, pinned: 'left' },
      {
        field: 'basis',
        header: 'Basis',
        kind: 'choice',
        width: 92,
        options: [
          { value: 'lump-sum', label: 'Lump sum' },
          { value: 'per-day', label: 'Per day' },
        ],
        headerTooltip:
          'Lump sum, or a rate per working day times the duration of an activity (time-dependent)',
      },
      {
        field: 'activityCode',
        header: 'Activity',
        kind: 'choice',
        width: 90,
        options: [{ value: null, label: '—' }, ...[...activityCodes].map((c) => ({ value: c, label: c }))],
        applies: (r) => r.basis === 'per-day',
        headerTooltip: 'The activity whose duration a per-day line is paid for',
      },
      ...distColumns({ allowNone: true }),
      {
        field: 'base',
        header: `Base (${currency})`,
        kind: 'number',
        width: 118,
        headerTooltip: 'Deterministic amount; when empty, the distribution’s base (shown in brackets)',
        format: (v, r) => {
          if (typeof v === 'number') return formatMoney(v);
          if (v != null) return String(v);
          const d = lineBase({ ...(r as object), base: null } as never, durations.base);
          return d === null ? '' : `(${formatMoney(d)})`;
        },
      },
      {
        field: '_mean',
        header: 'Mean',
        kind: 'computed',
        width: 110,
        value: (r) => summaries(r).mean,
        format: money,
      },
      {
        field: '_p10',
        header: 'P10',
        kind: 'computed',
        width: 110,
        value: (r) => summaries(r).p10,
        format: (v, r) => (r.basis === 'per-day' && r._key !== 'total' ? 'by run' : money(v)),
      },
      {
        field: '_p90',
        header: 'P90',
        kind: 'computed',
        width: 110,
        value: (r) => summaries(r).p90,
        format: (v, r) => (r.basis === 'per-day' && r._key !== 'total' ? 'by run' : money(v)),
      },
      { field: 'ownerName', header: 'Owner', kind: 'text', width: 120 },
      { field: 'notes', header: 'Notes', kind: 'text', width: 200 },
    ],
    [activityCodes, currency, durations, summaries, money],
  );

  const total = useMemo(() => {
    let base = 0;
    let mean = 0;
    for (const r of register.rows) {
      base += lineBase(r as never, durations.base) ?? 0;
      mean += lineMean(r, durations.mean) ?? 0;
    }
    return {
      _key: 'total',
      code: 'Total',
      description: `Base estimate (${currency})`,
      base,
      _mean: mean,
      _issues: {},
      _draft: false,
      _id: null,
      _version: null,
    };
  }, [register.rows, durations, currency]);

  const totalRow = useMemo(() => ({ ...total, _p10: null, _p90: null }), [total]);

  if (register.query.isPending) return <Skeleton rows={8} />;
  if (register.query.isError)
    return <Notice tone="invalid">The line items could not be loaded: {register.query.error.message}</Notice>;

  const codes = register.rows.map((r) => String(r.code ?? ''));
  return (
    <div className="space-y-2">
      <RegisterToolbar
        readOnly={readOnly}
        selected={page.selected.length}
        saving={register.saving}
        count={register.rows.length}
        noun="line"
        onAdd={() => register.insertRow(register.rows.length, { ...blank(0), code: nextCode(codes, '1.1') })}
        onInsert={page.insert}
        onDelete={page.remove}
        onMove={page.move}
      >
        <ImportExport projectId={projectId} register="items" readOnly={readOnly} />
      </RegisterToolbar>
      <RegisterNotice register={register} />
      {register.rows.length === 0 && readOnly ? <p className="text-ink-soft">No line items yet.</p> : null}
      <RegisterGrid
        label="Line items"
        rows={register.rows}
        columns={columns}
        readOnly={readOnly}
        onChange={register.applyValues}
        onAddRows={page.addRows}
        onSelectionChange={page.setSelected}
        onFocusRow={page.onFocusRow}
        totalRow={totalRow}
      />
    </div>
  );
}

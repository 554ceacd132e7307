'use client';
// The schedule: activities with duration ranges (working days) and predecessors typed as text,
// "A1, A3+5". An unknown code or a cycle is shown in the cell, naming the activities.
import { useCallback, useMemo } from 'react';
import { RegisterGrid } from '@/components/grid/register-grid';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { specFromParts, summarise, type DistType } from '@/lib/registers/dist-fields';
import { formatNumber } from '@/lib/registers/numbers';
import { checkNetwork } from '@/lib/sim';
import { distColumns } from './dist-columns';
import { ImportExport } from './import-export';
import { RegisterNotice } from './register-notice';
import { RegisterToolbar } from './register-toolbar';
import { nextCode, useRegisterPage } from './use-register-page';

type Link = { code: string; lag: number };

/** Network problems of the activities as they would be with `values` in place, for one row. */
function networkIssue(values: Record<string, unknown>, all: Record<string, unknown>[]): string | null {
  if (!Array.isArray(values.predecessors)) {
    return typeof values.predecessors === 'string'
      ? `"${values.predecessors}" is not a list of activities (write e.g. A1, A3+5 for a 5-day lag).`
      : null;
  }
  const list = all
    .filter((a) => a.code)
    .map((a) => ({
      id: String(a.code),
      duration: { type: 'fixed' as const, value: 0 },
      predecessors: Array.isArray(a.predecessors)
        ? (a.predecessors as Link[]).map((p) => ({ id: p.code, lag: p.lag }))
        : [],
    }));
  const mineAt = list.findIndex((a) => a.id === values.code);
  const problems = checkNetwork(list);
  const own = problems.find((p) => p.path[1] === mineAt);
  if (own) return `${own.message[0].toUpperCase()}${own.message.slice(1)}.`;
  const cycle = problems.find(
    (p) => p.message.includes('cycle') && p.message.includes(` ${String(values.code)} `),
  );
  return cycle ? `${cycle.message[0].toUpperCase()}${cycle.message.slice(1)}.` : null;
}

function durationSummary(row: GridRow) {
  const type = row.distType as DistType | null;
  if (!type) return null;
  const r = specFromParts({ ...(row as object), type } as never);
  return r.ok ? summarise(r.spec) : null;
}

export function ScheduleGrid({ projectId, readOnly }: { projectId: number; readOnly: boolean }) {
  const extraIssues = useCallback((v: Record<string, unknown>, all: Record<string, unknown>[]) => {
    const out: Record<string, string> = {};
    const issue = networkIssue(v, all);
    if (issue) out.predecessors = issue;
    if (v.code && all.filter((r) => r.code === v.code).length > 1)
      out.code = `${v.code} is used by another activity.`;
    return out;
  }, []);
  const blank = useCallback(
    () => ({ code: '', name: '', distType: 'triangular', range: 'min-max', predecessors: [] }),
    [],
  );
  const page = useRegisterPage(projectId, 'activities', blank, extraIssues);
  const { register } = page;

  // Saved rows that a later change made part of a cycle or left pointing at a missing code.
  const rows = useMemo(() => {
    const all = register.rows.map((r) => r as Record<string, unknown>);
    return register.rows.map((r) => {
      if (r._issues.predecessors) return r;
      const issue = networkIssue(r, all);
      return issue ? { ...r, _issues: { ...r._issues, predecessors: issue } } : r;
    });
  }, [register.rows]);

  const columns = useMemo<RegisterColumn[]>(
    () => [
      { field: 'code', header: 'Code', kind: 'text', width: 90, pinned: 'left' },
      { field: 'name', header: 'Activity', kind: 'text', width: 240, pinned: 'left' },
      ...distColumns({ unit: 'days' }),
      {
        field: 'predecessors',
        header: 'Predecessors',
        kind: 'predecessors',
        width: 170,
        headerTooltip: 'Finish-to-start links: A1, A3+5 (5 working days of lag), A4-2 (2 days of lead)',
      },
      {
        field: '_mean',
        header: 'Mean (days)',
        kind: 'computed',
        width: 100,
        value: (r) => durationSummary(r)?.mean ?? null,
        format: (v) => formatNumber(v as number, 1),
      },
      {
        field: '_p10',
        header: 'P10',
        kind: 'computed',
        width: 80,
        value: (r) => durationSummary(r)?.p10 ?? null,
        format: (v) => formatNumber(v as number, 1),
      },
      {
        field: '_p90',
        header: 'P90',
        kind: 'computed',
        width: 80,
        value: (r) => durationSummary(r)?.p90 ?? null,
        format: (v) => formatNumber(v as number, 1),
      },
    ],
    [],
  );

  if (register.query.isPending) return <Skeleton rows={8} />;
  if (register.query.isError)
    return <Notice tone="invalid">The schedule could not be loaded: {register.query.error.message}</Notice>;
  const codes = register.rows.map((r) => String(r.code ?? ''));
  return (
    <div className="space-y-2">
      <RegisterToolbar
        readOnly={readOnly}
        selected={page.selected.length}
        saving={register.saving}
        count={register.rows.length}
        noun="activity"
        plural="activities"
        onAdd={() => register.insertRow(register.rows.length, { ...blank(), code: nextCode(codes, 'A1') })}
        onInsert={page.insert}
        onDelete={page.remove}
        onMove={page.move}
      >
        <ImportExport projectId={projectId} register="activities" readOnly={readOnly} />
      </RegisterToolbar>
      <RegisterNotice register={register} />
      <RegisterGrid
        label="Schedule"
        rows={rows}
        columns={columns}
        readOnly={readOnly}
        onChange={register.applyValues}
        onAddRows={page.addRows}
        onSelectionChange={page.setSelected}
        onFocusRow={page.onFocusRow}
      />
    </div>
  );
}

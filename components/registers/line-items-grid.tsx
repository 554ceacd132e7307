'use client';
// The line items register: WBS lines with their distributions, computed mean and P10–P90 as
// you type, a total row with the base estimate, and lines indented by WBS level. A line is a lump
// sum, a rate per day of one activity, or a rate per project day (it runs with the whole
// project's simulated duration; its base uses the project's base duration).

import { useCallback, useMemo } from 'react';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { activityBaseDurations, lineBase, projectBaseDuration } from '@/lib/registers/base-estimate';
import { meanOf, specFromParts, summarise, type DistType } from '@/lib/registers/dist-fields';
import { formatMoney } from '@/lib/registers/numbers';
import { wbsLevel } from '@/lib/registers/wbs';
import { distColumns } from './dist-columns';
import { RegisterTab, type RegisterTabProps } from './register-tab';
import { summaryColumns, type RowSummary } from './summary-columns';
import { duplicateCodeIssue, totalRowOf, useRegisterPage, useSavedRows } from './use-register-page';

/** The line's mean without its percentiles (for the total row); per project day: only a run knows it. */
function lineMean(row: GridRow, meanDays: Map<string, number>): number | null {
  const type = row.distType as DistType | null;
  if (!type) return typeof row.base === 'number' ? row.base : null;
  const r = specFromParts({ ...(row as object), type } as never);
  if (!r.ok || row.basis === 'per-project-day') return null;
  if (row.basis !== 'per-day') return meanOf(r.spec);
  const days = meanDays.get(String(row.activityCode ?? ''));
  return days === undefined ? null : meanOf(r.spec) * days;
}

function lineSummary(row: GridRow, meanDays: Map<string, number>): RowSummary {
  const type = row.distType as DistType | null;
  if (!type) return { mean: typeof row.base === 'number' ? row.base : null, p10: null, p90: null };
  const r = specFromParts({ ...(row as object), type } as never);
  if (!r.ok) return { mean: null, p10: null, p90: null };
  const s = summarise(r.spec);
  // The project's duration has no mean before a run: the whole network's spread sets it.
  if (row.basis === 'per-project-day') return { mean: null, p10: null, p90: null };
  if (row.basis === 'per-day') {
    // E[rate × days] = E[rate]·E[days] for independent inputs; the spread depends on the schedule.
    const days = meanDays.get(String(row.activityCode ?? ''));
    return { mean: days === undefined ? null : s.mean * days, p10: null, p90: null };
  }
  return s;
}

export function LineItemsGrid({ projectId, currency, readOnly }: RegisterTabProps) {
  const activities = useSavedRows(projectId, 'activities');
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
      const duplicate = duplicateCodeIssue(v, all, 'line');
      if (duplicate) out.code = duplicate;
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
    const project = projectBaseDuration(rows);
    const mean = new Map<string, number>();
    for (const a of activities.data ?? []) {
      const r = specFromParts({ ...(a as object), type: a.distType } as never);
      if (r.ok) mean.set(String(a.code), summarise(r.spec).mean);
    }
    return { base, mean, project };
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
        width: 124,
        options: [
          { value: 'lump-sum', label: 'Lump sum' },
          { value: 'per-day', label: 'Per activity day' },
          { value: 'per-project-day', label: 'Per project day' },
        ],
        headerTooltip:
          'Lump sum; a rate per working day × the duration of one activity; or a rate per working day × the whole project’s duration (e.g. site overheads)',
      },
      {
        field: 'activityCode',
        header: 'Activity',
        kind: 'choice',
        width: 90,
        options: [{ value: null, label: '—' }, ...[...activityCodes].map((c) => ({ value: c, label: c }))],
        applies: (r) => r.basis === 'per-day',
        headerTooltip: 'The activity whose duration a per-activity-day line is paid for',
      },
      ...distColumns({ allowNone: true }),
      {
        field: 'base',
        header: `Base (${currency})`,
        kind: 'number',
        width: 118,
        pinned: 'right',
        headerTooltip:
          'Deterministic amount; when empty, the distribution’s base (shown in brackets). Per project day: the rate’s base × the project’s base duration (every activity at its base), not the simulated mean',
        format: (v, r) => {
          if (typeof v === 'number') return formatMoney(v);
          if (v != null) return String(v);
          const d = lineBase({ ...(r as object), base: null } as never, durations.base, durations.project);
          return d === null ? '' : `(${formatMoney(d)})`;
        },
      },
      ...summaryColumns(summaries, {
        meanHeader: `Line mean (${currency})`,
        widths: [110, 110],
        formatMean: (v, r) =>
          r.basis === 'per-project-day' || (r._key === 'total' && v === null) ? 'by run' : money(v),
        formatPercentile: (v, r) => (r.basis !== 'lump-sum' && r._key !== 'total' ? 'by run' : money(v)),
      }),
      { field: 'ownerName', header: 'Owner', kind: 'text', width: 120 },
      { field: 'notes', header: 'Notes', kind: 'text', width: 200 },
    ],
    [activityCodes, currency, durations, summaries, money],
  );

  const total = useMemo(() => {
    let base = 0;
    let mean: number | null = 0;
    for (const r of register.rows) {
      base += lineBase(r as never, durations.base, durations.project) ?? 0;
      // A per-project-day line's mean needs a run: the total's mean then does too.
      if (r.basis === 'per-project-day') mean = null;
      else if (mean !== null) mean += lineMean(r, durations.mean) ?? 0;
    }
    return totalRowOf({
      code: 'Total',
      description: `Base estimate (${currency})`,
      base,
      _mean: mean,
      _p10: null,
      _p90: null,
    });
  }, [register.rows, durations, currency]);

  return <RegisterTab page={page} readOnly={readOnly} columns={columns} totalRow={total} />;
}

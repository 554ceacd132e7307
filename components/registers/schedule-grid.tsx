'use client';
// The schedule: activities with duration ranges (working days), predecessors typed as text in
// our notation ("A1, A3 SS+2, A4 FF-1", lib/registers/predecessors) and the probability that a
// branch happens. A bad link, an unknown code or a cycle is shown in the cell, naming the activities.
import { useCallback, useMemo } from 'react';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { HealthFindings } from '@/components/schedule/health-findings';
import { NetworkDiagram } from '@/components/schedule/network-diagram';
import { activitiesOfRows } from '@/components/schedule/network-rows';
import { scheduleHealth } from '@/lib/domain/schedule-health';
import { specFromParts, summarise, type DistType } from '@/lib/registers/dist-fields';
import { formatNumber } from '@/lib/registers/numbers';
import { parsePredecessors, PREDECESSOR_HELP, type PredecessorLink } from '@/lib/registers/predecessors';
import { checkNetwork } from '@/lib/sim';
import { distColumns } from './dist-columns';
import { RegisterTab } from './register-tab';
import { summaryColumns } from './summary-columns';
import { duplicateCodeIssue, useRegisterPage } from './use-register-page';

/** Network problems of the activities as they would be with `values` in place, for one row. */
function networkIssue(values: Record<string, unknown>, all: Record<string, unknown>[]): string | null {
  if (!Array.isArray(values.predecessors)) {
    if (typeof values.predecessors !== 'string') return null;
    const parsed = parsePredecessors(values.predecessors);
    return parsed.ok ? null : parsed.error;
  }
  const list = all
    .filter((a) => a.code)
    .map((a) => ({
      id: String(a.code),
      duration: { type: 'fixed' as const, value: 0 },
      predecessors: Array.isArray(a.predecessors)
        ? (a.predecessors as PredecessorLink[]).map((p) => ({ id: p.code, type: p.type, lag: p.lag }))
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

const days = (v: unknown) => formatNumber(v as number, 1);

function durationSummary(row: GridRow) {
  const type = row.distType as DistType | null;
  if (!type) return null;
  const r = specFromParts({ ...(row as object), type } as never);
  return r.ok ? summarise(r.spec) : null;
}

export function ScheduleGrid({
  projectId,
  readOnly,
  latestRun = null,
}: {
  projectId: number;
  readOnly: boolean;
  /** Criticality from the latest successful run, for the diagram's highlight. */
  latestRun?: { runId: number; criticality: Record<string, number> } | null;
}) {
  const extraIssues = useCallback((v: Record<string, unknown>, all: Record<string, unknown>[]) => {
    const out: Record<string, string> = {};
    const issue = networkIssue(v, all);
    if (issue) out.predecessors = issue;
    const duplicate = duplicateCodeIssue(v, all, 'activity');
    if (duplicate) out.code = duplicate;
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
        width: 190,
        headerTooltip: PREDECESSOR_HELP,
      },
      {
        field: 'existence',
        header: 'Existence',
        kind: 'percent',
        width: 96,
        headerTooltip:
          'Probability that the activity happens at all (a branch such as a retest); empty: it always happens.',
      },
      ...summaryColumns(durationSummary, {
        meanHeader: 'Mean (days)',
        widths: [100, 80],
        formatMean: days,
        formatPercentile: days,
      }),
    ],
    [],
  );

  // The health check follows the grid as it is edited.
  const activities = useMemo(() => activitiesOfRows(register.rows), [register.rows]);
  const findings = useMemo(() => scheduleHealth(activities), [activities]);

  return (
    <div className="space-y-3">
      <RegisterTab page={page} readOnly={readOnly} columns={columns} rows={rows} />
      {register.query.isSuccess ? (
        <>
          <HealthFindings findings={findings} activityCount={activities.length} context="schedule" />
          {activities.length ? (
            <NetworkDiagram
              activities={activities}
              criticality={latestRun?.criticality ?? null}
              runLabel={latestRun ? `run ${latestRun.runId}` : null}
            />
          ) : null}
        </>
      ) : null}
    </div>
  );
}

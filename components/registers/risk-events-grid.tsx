'use client';
// The risk events register with each risk's expected value and the probability–impact matrix.
import { useCallback, useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { callApi } from '@/components/forms/api';
import { RegisterGrid } from '@/components/grid/register-grid';
import type { RegisterColumn } from '@/components/grid/columns';
import { registerQueryKey, type GridRow, type SavedRow } from '@/components/grid/use-register-rows';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { baseEstimate } from '@/lib/registers/base-estimate';
import { specFromParts, summarise, DIST_LABELS } from '@/lib/registers/dist-fields';
import { formatMoney, formatNumber } from '@/lib/registers/numbers';
import {
  impactParts,
  RISK_IMPACT_TYPES,
  RISK_RESPONSES,
  RISK_STATUSES,
  type ImpactPrefix,
} from '@/lib/validation/registers';
import { ImportExport } from './import-export';
import { ProbabilityImpactMatrix } from './probability-impact-matrix';
import { RegisterNotice } from './register-notice';
import { RegisterToolbar } from './register-toolbar';
import { nextCode, useRegisterPage } from './use-register-page';

function impactMean(row: GridRow, prefix: ImpactPrefix): number | null {
  const parts = impactParts(row, prefix);
  if (!parts) return null;
  const r = specFromParts(parts);
  return r.ok ? summarise(r.spec).mean : null;
}

const choice = (values: readonly string[]) =>
  values.map((v) => ({ value: v, label: v[0].toUpperCase() + v.slice(1) }));
const impactTypes = [
  { value: null, label: '—' },
  ...RISK_IMPACT_TYPES.map((t) => ({ value: t, label: DIST_LABELS[t] })),
];

function impactColumns(prefix: 'cost' | 'delay', unit: string): RegisterColumn[] {
  const t = `${prefix}Type`;
  const has = (part: string) => (r: GridRow) => {
    const type = r[t] as string | null;
    if (!type) return false;
    if (type === 'fixed') return part === 'Mode';
    if (type === 'uniform' || type === 'lognormal') return part !== 'Mode';
    return true;
  };
  const name = prefix === 'cost' ? 'Cost' : 'Delay';
  return [
    { field: t, header: name, kind: 'choice', width: 100, options: impactTypes },
    {
      field: `${prefix}Low`,
      header: `${name} low (${unit})`,
      kind: 'number',
      width: 110,
      applies: has('Low'),
    },
    {
      field: `${prefix}Mode`,
      header: `${name} most likely`,
      kind: 'number',
      width: 116,
      applies: has('Mode'),
    },
    { field: `${prefix}High`, header: `${name} high`, kind: 'number', width: 100, applies: has('High') },
  ];
}

export function RiskEventsGrid({
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
  const items = useQuery({
    queryKey: registerQueryKey(projectId, 'items'),
    queryFn: async () => (await callApi<{ rows: SavedRow[] }>(`/api/projects/${projectId}/items`)).rows,
  });
  const activityCodes = useMemo(() => (activities.data ?? []).map((a) => String(a.code)), [activities.data]);
  const extraIssues = useCallback(
    (v: Record<string, unknown>, all: Record<string, unknown>[]) => {
      const out: Record<string, string> = {};
      if (v.activityCode && activities.data && !activityCodes.includes(String(v.activityCode))) {
        out.activityCode = `Unknown activity "${v.activityCode}".`;
      }
      if (v.code && all.filter((r) => r.code === v.code).length > 1)
        out.code = `${v.code} is used by another risk.`;
      return out;
    },
    [activities.data, activityCodes],
  );
  const blank = useCallback(
    () => ({
      code: '',
      title: '',
      status: 'open',
      response: 'reduce',
      probability: null,
      costType: 'triangular',
    }),
    [],
  );
  const page = useRegisterPage(projectId, 'risks', blank, extraIssues);
  const { register } = page;
  const base = useMemo(
    () => baseEstimate((items.data ?? []) as never[], (activities.data ?? []) as never[]),
    [items.data, activities.data],
  );

  const columns = useMemo<RegisterColumn[]>(
    () => [
      { field: 'code', header: 'Code', kind: 'text', width: 80, pinned: 'left' },
      { field: 'title', header: 'Title', kind: 'text', width: 220, pinned: 'left' },
      { field: 'status', header: 'Status', kind: 'choice', width: 100, options: choice(RISK_STATUSES) },
      { field: 'probability', header: 'Probability', kind: 'percent', width: 100 },
      ...impactColumns('cost', currency),
      ...impactColumns('delay', 'days'),
      {
        field: 'activityCode',
        header: 'Delays activity',
        kind: 'choice',
        width: 110,
        options: [{ value: null, label: '—' }, ...activityCodes.map((c) => ({ value: c, label: c }))],
      },
      {
        field: '_ev',
        header: `Expected cost (${currency})`,
        kind: 'computed',
        width: 130,
        headerTooltip: 'Probability × mean cost impact',
        value: (r) => {
          const m = impactMean(r, 'cost');
          return m === null || typeof r.probability !== 'number' ? null : r.probability * m;
        },
        format: (v) => (typeof v === 'number' ? formatMoney(v) : ''),
      },
      {
        field: '_evDelay',
        header: 'Expected delay (days)',
        kind: 'computed',
        width: 120,
        value: (r) => {
          const m = impactMean(r, 'delay');
          return m === null || typeof r.probability !== 'number' ? null : r.probability * m;
        },
        format: (v) => (typeof v === 'number' ? formatNumber(v, 1) : ''),
      },
      { field: 'response', header: 'Response', kind: 'choice', width: 96, options: choice(RISK_RESPONSES) },
      { field: 'ownerName', header: 'Owner', kind: 'text', width: 110 },
      { field: 'mitigationCost', header: `Mitigation cost`, kind: 'number', width: 116 },
      { field: 'postProbability', header: 'Post probability', kind: 'percent', width: 110 },
      {
        field: 'postCostLow',
        header: 'Post cost low',
        kind: 'number',
        width: 104,
        applies: (r) => Boolean(r.costType) && r.costType !== 'fixed',
      },
      {
        field: 'postCostMode',
        header: 'Post cost most likely',
        kind: 'number',
        width: 130,
        applies: (r) => Boolean(r.costType) && r.costType !== 'uniform' && r.costType !== 'lognormal',
      },
      {
        field: 'postCostHigh',
        header: 'Post cost high',
        kind: 'number',
        width: 104,
        applies: (r) => Boolean(r.costType) && r.costType !== 'fixed',
      },
      {
        field: 'postDelayLow',
        header: 'Post delay low',
        kind: 'number',
        width: 104,
        applies: (r) => Boolean(r.delayType) && r.delayType !== 'fixed',
      },
      {
        field: 'postDelayMode',
        header: 'Post delay most likely',
        kind: 'number',
        width: 134,
        applies: (r) => Boolean(r.delayType) && r.delayType !== 'uniform' && r.delayType !== 'lognormal',
      },
      {
        field: 'postDelayHigh',
        header: 'Post delay high',
        kind: 'number',
        width: 104,
        applies: (r) => Boolean(r.delayType) && r.delayType !== 'fixed',
      },
      { field: 'cause', header: 'Cause', kind: 'text', width: 180 },
      { field: 'event', header: 'Event', kind: 'text', width: 180 },
      { field: 'effect', header: 'Effect', kind: 'text', width: 180 },
    ],
    [activityCodes, currency],
  );

  const total = useMemo(() => {
    let ev = 0;
    let evDelay = 0;
    for (const r of register.rows) {
      if (r.status === 'closed' || typeof r.probability !== 'number') continue;
      ev += r.probability * (impactMean(r, 'cost') ?? 0);
      evDelay += r.probability * (impactMean(r, 'delay') ?? 0);
    }
    return {
      _key: 'total',
      code: 'Total',
      title: 'Open risks, expected',
      _ev: ev,
      _evDelay: evDelay,
      _issues: {},
      _draft: false,
      _id: null,
      _version: null,
    };
  }, [register.rows]);
  const totalRow = useMemo(() => total, [total]);

  if (register.query.isPending) return <Skeleton rows={8} />;
  if (register.query.isError)
    return (
      <Notice tone="invalid">The risk events could not be loaded: {register.query.error.message}</Notice>
    );
  const codes = register.rows.map((r) => String(r.code ?? ''));
  return (
    <div className="space-y-2">
      <RegisterToolbar
        readOnly={readOnly}
        selected={page.selected.length}
        saving={register.saving}
        count={register.rows.length}
        noun="risk"
        onAdd={() => register.insertRow(register.rows.length, { ...blank(), code: nextCode(codes, 'R1') })}
        onInsert={page.insert}
        onDelete={page.remove}
        onMove={page.move}
      >
        <ImportExport projectId={projectId} register="risks" readOnly={readOnly} />
      </RegisterToolbar>
      <RegisterNotice register={register} />
      <div className="grid grid-cols-[1fr_auto] gap-3">
        <div className="min-w-0">
          <RegisterGrid
            label="Risk events"
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
        <ProbabilityImpactMatrix
          risks={register.rows}
          baseEstimate={base}
          meanCost={(r) => impactMean(r, 'cost')}
        />
      </div>
    </div>
  );
}

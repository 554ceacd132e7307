'use client';
// The risk events register with each risk's expected value and the probability–impact matrix.
import { useCallback, useMemo } from 'react';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
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
import { ProbabilityImpactMatrix } from './probability-impact-matrix';
import { RegisterTab, type RegisterTabProps } from './register-tab';
import { duplicateCodeIssue, totalRowOf, useRegisterPage, useSavedRows } from './use-register-page';

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

const PARTS = ['Low', 'Mode', 'High'] as const;

/** Whether a low, most likely or high cell takes a value under the row's impact type. */
const hasPart = (typeField: string, part: (typeof PARTS)[number]) => (r: GridRow) => {
  const type = r[typeField] as string | null;
  if (!type) return false;
  if (type === 'fixed') return part === 'Mode';
  if (type === 'uniform' || type === 'lognormal') return part !== 'Mode';
  return true;
};

/** The low, most likely and high cells of one impact, before or after mitigation. */
function partColumns(
  field: string,
  typeField: string,
  headers: [string, string, string],
  widths: [number, number, number],
): RegisterColumn[] {
  return PARTS.map((part, i) => ({
    field: `${field}${part}`,
    header: headers[i],
    kind: 'number',
    width: widths[i],
    applies: hasPart(typeField, part),
  }));
}

function impactColumns(prefix: 'cost' | 'delay', unit: string): RegisterColumn[] {
  const t = `${prefix}Type`;
  const name = prefix === 'cost' ? 'Cost' : 'Delay';
  return [
    { field: t, header: name, kind: 'choice', width: 100, options: impactTypes },
    ...partColumns(
      prefix,
      t,
      [`${name} low (${unit})`, `${name} most likely`, `${name} high`],
      [110, 116, 100],
    ),
  ];
}

/** Probability × mean impact, the risk's expected cost or delay. */
function expectedColumn(
  field: string,
  header: string,
  prefix: ImpactPrefix,
  width: number,
  format: (v: number) => string,
): RegisterColumn {
  return {
    field,
    header,
    kind: 'computed',
    width,
    value: (r) => {
      const m = impactMean(r, prefix);
      return m === null || typeof r.probability !== 'number' ? null : r.probability * m;
    },
    format: (v) => (typeof v === 'number' ? format(v) : ''),
  };
}

export function RiskEventsGrid({ projectId, currency, readOnly }: RegisterTabProps) {
  const activities = useSavedRows(projectId, 'activities');
  const items = useSavedRows(projectId, 'items');
  const activityCodes = useMemo(() => (activities.data ?? []).map((a) => String(a.code)), [activities.data]);
  const extraIssues = useCallback(
    (v: Record<string, unknown>, all: Record<string, unknown>[]) => {
      const out: Record<string, string> = {};
      if (v.activityCode && activities.data && !activityCodes.includes(String(v.activityCode))) {
        out.activityCode = `Unknown activity "${v.activityCode}".`;
      }
      const duplicate = duplicateCodeIssue(v, all, 'risk');
      if (duplicate) out.code = duplicate;
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
        ...expectedColumn('_ev', `Expected cost (${currency})`, 'cost', 130, formatMoney),
        headerTooltip: 'Probability × mean cost impact',
      },
      expectedColumn('_evDelay', 'Expected delay (days)', 'delay', 120, (v) => formatNumber(v, 1)),
      { field: 'response', header: 'Response', kind: 'choice', width: 96, options: choice(RISK_RESPONSES) },
      { field: 'ownerName', header: 'Owner', kind: 'text', width: 110 },
      { field: 'mitigationCost', header: `Mitigation cost`, kind: 'number', width: 116 },
      { field: 'postProbability', header: 'Post probability', kind: 'percent', width: 110 },
      ...partColumns(
        'postCost',
        'costType',
        ['Post cost low', 'Post cost most likely', 'Post cost high'],
        [104, 130, 104],
      ),
      ...partColumns(
        'postDelay',
        'delayType',
        ['Post delay low', 'Post delay most likely', 'Post delay high'],
        [104, 134, 104],
      ),
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
    return totalRowOf({ code: 'Total', title: 'Open risks, expected', _ev: ev, _evDelay: evDelay });
  }, [register.rows]);
  return (
    <RegisterTab
      page={page}
      readOnly={readOnly}
      columns={columns}
      totalRow={total}
      aside={
        <ProbabilityImpactMatrix
          risks={register.rows}
          baseEstimate={base}
          meanCost={(r) => impactMean(r, 'cost')}
        />
      }
    />
  );
}

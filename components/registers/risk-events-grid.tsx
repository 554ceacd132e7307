'use client';
// The risk events register: threats and opportunities, before and after their response side by
// side in column groups (the mean and SD cells open with their group), the activities and cost
// lines each risk touches, the response's cost, each risk's expected value, and the
// probability–impact matrix.
import { useCallback, useMemo } from 'react';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { STATUS_RULES } from '@/lib/domain/model-export';
import { baseEstimate } from '@/lib/registers/base-estimate';
import { DIST_LABELS, partApplies, type DistPart, type DistType } from '@/lib/registers/dist-fields';
import { formatMoney, formatNumber } from '@/lib/registers/numbers';
import {
  impactMean,
  impactTypeField,
  MITIGATION_TYPES,
  mitigationMean,
  riskDirection,
  RISK_IMPACT_TYPES,
  RISK_SIZES,
  type ImpactPrefix,
} from '@/lib/registers/risk-fields';
import { RISK_RESPONSES, RISK_STATUSES } from '@/lib/validation/registers';
import { CodePickEditor, type CodeOption } from './code-pick-editor';
import { ProbabilityImpactMatrix } from './probability-impact-matrix';
import { RegisterTab, type RegisterTabProps } from './register-tab';
import { duplicateCodeIssue, totalRowOf, useRegisterPage, useSavedRows } from './use-register-page';

const choice = (values: readonly string[]) =>
  values.map((v) => ({ value: v, label: v[0].toUpperCase() + v.slice(1) }));
const impactTypes = [
  { value: null, label: '—' },
  ...RISK_IMPACT_TYPES.map((t) => ({ value: t, label: DIST_LABELS[t] })),
];

const PARTS: { cell: string; part: DistPart; header: string; show?: 'open' }[] = [
  { cell: 'Low', part: 'low', header: 'low' },
  { cell: 'Mode', part: 'mode', header: 'most likely' },
  { cell: 'High', part: 'high', header: 'high' },
  { cell: 'Mean', part: 'mean', header: 'mean', show: 'open' },
  { cell: 'Sd', part: 'sd', header: 'SD', show: 'open' },
];

const DIRECTION_TEXT = { threat: 'Threat', opportunity: 'Opportunity', both: 'Both' } as const;
const OPPORTUNITY_TONE = 'text-opportunity';

/** Whether an impact's cell takes a value under the row's impact type. */
const applies = (prefix: ImpactPrefix, part: DistPart) => (r: GridRow) => {
  const type = r[impactTypeField(prefix)] as DistType | null;
  return !!type && partApplies(type, part);
};

/** A negative amount in an impact or expected value reads as an opportunity, not an error. */
const negativeTone = (field: string) => (r: GridRow) =>
  typeof r[field] === 'number' && (r[field] as number) < 0 ? OPPORTUNITY_TONE : null;

/** The cells of one impact before its response, then after it: side by side in one group. */
function impactColumns(kind: 'cost' | 'delay', group: string): RegisterColumn[] {
  const post: ImpactPrefix = kind === 'cost' ? 'postCost' : 'postDelay';
  const cells = (prefix: ImpactPrefix, after: boolean): RegisterColumn[] =>
    PARTS.map(({ cell, part, header, show }) => ({
      field: `${prefix}${cell}`,
      header: after ? `After: ${header}` : header[0].toUpperCase() + header.slice(1),
      kind: 'number',
      width: after ? 104 : 92,
      group,
      groupShow: show,
      applies: applies(prefix, part),
      cellClass: negativeTone(`${prefix}${cell}`),
      headerTooltip: after
        ? `After the response: ${header} (empty keeps the value before it)`
        : part === 'low' || part === 'high'
          ? `${header} (the P10 or P90 for a lognormal); negative for an opportunity`
          : `${header}; negative for an opportunity`,
    }));
  return [
    {
      field: `${kind}Type`,
      header: 'Distribution',
      kind: 'choice',
      width: 104,
      options: impactTypes,
      group,
      headerTooltip: `The ${kind}'s distribution, before and after the response. Its group header's arrow hides the mean and SD cells.`,
    },
    ...cells(kind, false),
    ...cells(post, true),
  ];
}

/** Probability × mean impact, the risk's expected cost or delay (after: plus the response's cost). */
function expectedColumn(
  field: string,
  header: string,
  value: (r: GridRow) => number | null,
  format: (v: number) => string,
  headerTooltip: string,
): RegisterColumn {
  return {
    field,
    header,
    kind: 'computed',
    width: 118,
    group: 'Expected value',
    value,
    format: (v) => (typeof v === 'number' ? format(v) : ''),
    cellClass: (r) => {
      const v = value(r);
      return v !== null && v < 0 ? OPPORTUNITY_TONE : null;
    },
    headerTooltip,
  };
}

const expectedBefore = (prefix: 'cost' | 'delay') => (r: GridRow) => {
  const m = impactMean(r, prefix);
  return m === null || typeof r.probability !== 'number' ? null : r.probability * m;
};

function expectedCostAfter(r: GridRow): number | null {
  const m = impactMean(r, 'postCost');
  const p = typeof r.postProbability === 'number' ? r.postProbability : r.probability;
  const response = mitigationMean(r);
  if (typeof p !== 'number' || response === null) return null;
  return p * (m ?? 0) + response;
}

/** The multi-pick column of a risk's activities or cost lines. */
function codesColumn(
  field: string,
  header: string,
  options: CodeOption[],
  noun: string,
  headerTooltip: string,
  applies: (r: GridRow) => boolean,
): RegisterColumn {
  return {
    field,
    header,
    kind: 'codes',
    width: 130,
    group: 'Touches',
    applies,
    editor: { component: CodePickEditor, params: { options, noun }, popup: true },
    headerTooltip,
  };
}

export function RiskEventsGrid({ projectId, currency, readOnly }: RegisterTabProps) {
  const activities = useSavedRows(projectId, 'activities');
  const items = useSavedRows(projectId, 'items');
  const correlations = useSavedRows(projectId, 'correlations');
  const activityOptions = useMemo<CodeOption[]>(
    () => (activities.data ?? []).map((a) => ({ code: String(a.code), label: String(a.name ?? '') })),
    [activities.data],
  );
  const itemOptions = useMemo<CodeOption[]>(
    () => (items.data ?? []).map((i) => ({ code: String(i.code), label: String(i.description ?? '') })),
    [items.data],
  );
  const extraIssues = useCallback(
    (v: Record<string, unknown>, all: Record<string, unknown>[]) => {
      const out: Record<string, string> = {};
      const unknown = (field: string, known: CodeOption[] | null, what: string) => {
        if (!known || !Array.isArray(v[field])) return;
        const missing = (v[field] as string[]).find((c) => !known.some((o) => o.code === c));
        if (missing) out[field] = `Unknown ${what} "${missing}".`;
      };
      unknown('activityCodes', activities.data ? activityOptions : null, 'activity');
      unknown('itemCodes', items.data ? itemOptions : null, 'line item');
      const duplicate = duplicateCodeIssue(v, all, 'risk');
      if (duplicate) out.code = duplicate;
      return out;
    },
    [activities.data, activityOptions, items.data, itemOptions],
  );
  const blank = useCallback(
    () => ({
      code: '',
      title: '',
      status: 'open',
      response: 'reduce',
      probability: null,
      costType: 'triangular',
      activityCodes: [],
      itemCodes: [],
      sizes: 'linked',
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
      { field: 'code', header: 'Code', kind: 'text', width: 76, pinned: 'left' },
      { field: 'title', header: 'Title', kind: 'text', width: 190, pinned: 'left' },
      {
        field: '_direction',
        header: 'Kind',
        kind: 'computed',
        width: 96,
        group: 'Risk',
        value: (r) => {
          const d = riskDirection(r);
          return d ? DIRECTION_TEXT[d] : null;
        },
        cellClass: (r) => (riskDirection(r) === 'opportunity' ? `${OPPORTUNITY_TONE} font-medium` : null),
        headerTooltip: 'Threat (adds cost or time), opportunity (saves them) or both, from its mean impacts',
      },
      {
        field: 'status',
        header: 'Status',
        kind: 'choice',
        width: 100,
        options: choice(RISK_STATUSES),
        group: 'Risk',
        headerTooltip: `${STATUS_RULES.occurred} ${STATUS_RULES.closed}`,
      },
      {
        field: 'response',
        header: 'Response',
        kind: 'choice',
        width: 92,
        options: choice(RISK_RESPONSES),
        group: 'Risk',
      },
      { field: 'ownerName', header: 'Owner', kind: 'text', width: 104, group: 'Risk' },
      { field: 'probability', header: 'Before', kind: 'percent', width: 80, group: 'Probability' },
      {
        field: 'postProbability',
        header: 'After',
        kind: 'percent',
        width: 80,
        group: 'Probability',
        headerTooltip: 'After the response (empty keeps the probability before it)',
      },
      ...impactColumns('cost', `Cost (${currency})`),
      ...impactColumns('delay', 'Delay (working days)'),
      codesColumn(
        'activityCodes',
        'Delays activities',
        activityOptions,
        'activities',
        'Every activity the delay lengthens (a negative delay shortens them)',
        (r) => !!r.delayType,
      ),
      codesColumn(
        'itemCodes',
        'Cost lines',
        itemOptions,
        'line items',
        'The WBS lines the cost belongs to: contingency is allocated to them',
        (r) => !!r.costType,
      ),
      {
        field: 'sizes',
        header: 'Sizes',
        kind: 'choice',
        width: 100,
        group: 'Touches',
        options: choice(RISK_SIZES),
        headerTooltip:
          'Linked: a large cost comes with a long delay (one draw). Independent: each has its own.',
      },
      {
        field: 'mitigationType',
        header: 'Distribution',
        kind: 'choice',
        width: 104,
        group: `Response cost (${currency})`,
        options: [
          { value: null, label: '—' },
          ...MITIGATION_TYPES.map((t) => ({ value: t, label: DIST_LABELS[t] })),
        ],
        headerTooltip: 'Fixed for one amount, or a range; counted in the post-mitigation total',
      },
      {
        field: 'mitigationLow',
        header: 'Low',
        kind: 'number',
        width: 90,
        group: `Response cost (${currency})`,
        applies: (r) => !!r.mitigationType && r.mitigationType !== 'fixed',
      },
      {
        field: 'mitigationCost',
        header: 'Amount / most likely',
        kind: 'number',
        width: 130,
        group: `Response cost (${currency})`,
        applies: (r) => r.mitigationType !== 'uniform',
      },
      {
        field: 'mitigationHigh',
        header: 'High',
        kind: 'number',
        width: 90,
        group: `Response cost (${currency})`,
        applies: (r) => !!r.mitigationType && r.mitigationType !== 'fixed',
      },
      expectedColumn(
        '_ev',
        `Cost before (${currency})`,
        expectedBefore('cost'),
        formatMoney,
        'Probability × mean cost impact, before the response',
      ),
      expectedColumn(
        '_evPost',
        `Cost after (${currency})`,
        expectedCostAfter,
        formatMoney,
        'After the response: its probability × mean cost impact, plus the mean cost of the response',
      ),
      expectedColumn(
        '_evDelay',
        'Delay before (days)',
        expectedBefore('delay'),
        (v) => formatNumber(v, 1),
        'Probability × mean delay, before the response',
      ),
      { field: 'cause', header: 'Cause', kind: 'text', width: 170, group: 'Description' },
      { field: 'event', header: 'Event', kind: 'text', width: 170, group: 'Description' },
      { field: 'effect', header: 'Effect', kind: 'text', width: 170, group: 'Description' },
    ],
    [activityOptions, itemOptions, currency],
  );

  const total = useMemo(() => {
    let ev = 0;
    let evPost = 0;
    let evDelay = 0;
    for (const r of register.rows) {
      if (r.status === 'closed' || typeof r.probability !== 'number') continue;
      // An occurred risk counts as certain, as in the model.
      const p = r.status === 'occurred' ? 1 : r.probability;
      ev += p * (impactMean(r, 'cost') ?? 0);
      evDelay += p * (impactMean(r, 'delay') ?? 0);
      evPost += expectedCostAfter(r.status === 'occurred' ? { ...r, postProbability: 1 } : r) ?? 0;
    }
    return totalRowOf({
      code: 'Total',
      title: 'Open risks, expected',
      _ev: ev,
      _evPost: evPost,
      _evDelay: evDelay,
    });
  }, [register.rows]);
  return (
    <RegisterTab
      page={page}
      readOnly={readOnly}
      columns={columns}
      totalRow={total}
      note={<StatusRules rows={register.rows} correlations={correlations.data ?? []} />}
      aside={<ProbabilityImpactMatrix risks={register.rows} baseEstimate={base} meanCost={threatCost} />}
    />
  );
}

/** The matrix places threats: an opportunity's saving is not a small threat. */
function threatCost(r: GridRow): number | null {
  const m = impactMean(r, 'cost');
  return m !== null && m < 0 ? null : m;
}

/** The status rules the model follows, stated above the grid, with what they leave out now. */
function StatusRules({ rows, correlations }: { rows: GridRow[]; correlations: Record<string, unknown>[] }) {
  const closed = new Set(rows.filter((r) => r.status === 'closed').map((r) => String(r.code)));
  const pairs = correlations
    .filter((c) => closed.has(String(c.aCode)) || closed.has(String(c.bCode)))
    .map((c) => `${c.aCode}–${c.bCode}`);
  const occurred = rows.filter((r) => r.status === 'occurred').map((r) => String(r.code));
  return (
    <div className="space-y-0.5 text-xs text-ink-soft" data-testid="risk-status-rules">
      <p>
        <strong className="font-medium text-ink">Status rules:</strong> {STATUS_RULES.occurred}{' '}
        {STATUS_RULES.closed} Negative costs and delays are{' '}
        <span className="font-medium text-opportunity">opportunities</span>, not errors.
      </p>
      {closed.size || occurred.length ? (
        <p data-testid="risk-status-effect">
          {closed.size
            ? `Left out of the model now: ${[...closed].join(', ')}${pairs.length ? ` and the correlation${pairs.length > 1 ? 's' : ''} ${pairs.join(', ')}` : ''}. `
            : ''}
          {occurred.length ? `Counted as certain: ${occurred.join(', ')}.` : ''}
        </p>
      ) : null}
    </div>
  );
}

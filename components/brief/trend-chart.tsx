'use client';

import type { ChartDataset } from 'chart.js';
import { Chart } from 'react-chartjs-2';
import { COLORS } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { formatDays, formatMoney, formatMoneyShort } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import type { TrendRow } from '@/lib/brief/trend';
import type { Scenario } from '@/lib/brief/scenario';

const SCENARIO_LABEL: Record<Scenario, string> = { pre: 'pre-mitigation', post: 'post-mitigation' };
const SCENARIO_DASH: Record<Scenario, number[] | undefined> = { pre: [6, 4], post: undefined };

const labelsOf = (rows: TrendRow[]) =>
  rows.map((r) => [r.stage, `${dateText(r.decidedAt)}${r.selfApproved ? ' (self-approved)' : ''}`]);

/** The value of a row where it is of the scenario, else a gap: lines never join two scenarios. */
const only = (rows: TrendRow[], s: Scenario, pick: (r: TrendRow) => number | null) =>
  rows.map((r) => (r.scenario === s ? pick(r) : null));

const common = {
  maintainAspectRatio: false,
  interaction: { mode: 'index' as const, intersect: false },
  plugins: { legend: { position: 'bottom' as const, labels: { boxWidth: 18, boxHeight: 3 } } },
};

type BarSet = ChartDataset<'bar', (number | null)[]>;

/** One drawdown in its own chart: bars on an axis of their own unit, from zero. */
function DrawdownChart(props: {
  title: string;
  reading: string;
  testId: string;
  labels: string[][];
  datasets: BarSet[];
  axisTitle: string;
  show: (v: number) => string;
  tick: (v: number) => string;
}) {
  return (
    <ChartFrame title={props.title} reading={props.reading} height={200} testId={props.testId}>
      <Chart
        type="bar"
        aria-label={props.title}
        role="img"
        data={{ labels: props.labels, datasets: props.datasets }}
        options={{
          ...common,
          plugins: {
            ...common.plugins,
            tooltip: {
              callbacks: { label: (ctx) => `${ctx.dataset.label}: ${props.show(Number(ctx.parsed.y))}` },
            },
          },
          scales: {
            x: { stacked: true },
            y: {
              beginAtZero: true,
              title: { display: true, text: props.axisTitle },
              ticks: { callback: (v) => props.tick(Number(v)) },
            },
          },
        }}
      />
    </ChartFrame>
  );
}

/**
 * Approved baselines over the stage gates, in three charts that each keep one unit on one axis:
 * the totals (money), the contingency drawdown (money, from zero) and the schedule margin
 * drawdown (working days, from zero). Pre- and post-mitigation baselines are separate lines.
 */
export function TrendCharts({ rows, currency }: { rows: TrendRow[]; currency: string }) {
  const scenarios = (['pre', 'post'] as const).filter((s) => rows.some((r) => r.scenario === s));
  const labels = labelsOf(rows);
  const money = (v: number) => formatMoney(v, currency);
  const last = rows[rows.length - 1];
  const mixed = scenarios.length > 1;

  const line = (label: string, data: (number | null)[], color: string, dash?: number[]) => ({
    type: 'line' as const,
    label,
    data,
    borderColor: color,
    backgroundColor: color,
    borderDash: dash,
    pointRadius: 4,
    tension: 0,
    spanGaps: false,
  });
  const costDatasets = scenarios.flatMap((s) => [
    line(
      `P80 · ${SCENARIO_LABEL[s]}`,
      only(rows, s, (r) => r.p80),
      COLORS.cost,
      SCENARIO_DASH[s],
    ),
    line(
      `P50 · ${SCENARIO_LABEL[s]}`,
      only(rows, s, (r) => r.p50),
      COLORS.time,
      SCENARIO_DASH[s],
    ),
    line(
      `Base · ${SCENARIO_LABEL[s]}`,
      only(rows, s, (r) => r.base),
      COLORS.inkSoft,
      [2, 3],
    ),
  ]);
  const bars = (label: string, data: (number | null)[], color: string, s: Scenario): BarSet => ({
    type: 'bar' as const,
    label: mixed ? `${label} · ${SCENARIO_LABEL[s]}` : label,
    data,
    // Told apart by colour only when both scenarios are drawn.
    backgroundColor: mixed && s === 'pre' ? 'rgba(183, 121, 31, 0.25)' : color,
    borderColor: mixed && s === 'pre' ? COLORS.caution : color,
    borderWidth: 1,
    maxBarThickness: 36,
  });
  // Read within each scenario: a change from pre- to post-mitigation is the response, not a drawdown.
  const reading = scenarios
    .map((sc) => {
      const own = rows.filter((r) => r.scenario === sc);
      const head = mixed ? `${SCENARIO_LABEL[sc][0].toUpperCase()}${SCENARIO_LABEL[sc].slice(1)}: ` : '';
      return own.length > 1
        ? `${head}contingency at P80 went from ${money(own[0].contingencyP80)} to ${money(own[own.length - 1].contingencyP80)} over ${own.length} baselines.`
        : `${head}one baseline so far, contingency at P80 ${money(own[0].contingencyP80)}.`;
    })
    .join(' ');
  const withSchedule = rows.some((r) => r.scheduleMarginP80 !== null);

  return (
    <div className="grid grid-cols-3 gap-3">
      <ChartFrame
        title="Total cost of each approved baseline"
        reading={
          mixed
            ? 'Pre- and post-mitigation baselines are drawn as separate lines: the step between them is the response, not a drawdown.'
            : `Every baseline is ${SCENARIO_LABEL[scenarios[0]]}.`
        }
        height={200}
        testId="trend-chart"
      >
        <Chart
          type="line"
          aria-label="P50, P80 and base of each approved baseline"
          role="img"
          data={{ labels, datasets: costDatasets }}
          options={{
            ...common,
            plugins: {
              ...common.plugins,
              tooltip: {
                callbacks: { label: (ctx) => `${ctx.dataset.label}: ${money(Number(ctx.parsed.y))}` },
              },
            },
            scales: {
              y: {
                // The totals sit far from zero; starting at zero would flatten the differences.
                beginAtZero: false,
                title: { display: true, text: `Total cost (${currency})` },
                ticks: { callback: (v) => formatMoneyShort(Number(v), currency) },
              },
            },
          }}
        />
      </ChartFrame>
      <DrawdownChart
        title="Contingency drawdown by stage"
        reading={reading}
        testId="trend-contingency"
        datasets={scenarios.map((s) =>
          bars(
            'Contingency at P80',
            only(rows, s, (r) => r.contingencyP80),
            COLORS.costLight,
            s,
          ),
        )}
        labels={labels}
        axisTitle={`Contingency at P80 (${currency})`}
        show={money}
        tick={(v) => formatMoneyShort(v, currency)}
      />
      {withSchedule ? (
        <DrawdownChart
          title="Schedule margin drawdown by stage"
          reading={`Working days between the P80 duration and the base duration; latest ${last.scheduleMarginP80 === null ? '—' : formatDays(last.scheduleMarginP80)}.`}
          testId="trend-schedule"
          datasets={scenarios.map((s) =>
            bars(
              'Schedule margin at P80',
              only(rows, s, (r) => r.scheduleMarginP80),
              COLORS.timeLight,
              s,
            ),
          )}
          labels={labels}
          axisTitle="Schedule margin at P80 (working days)"
          show={(v) => formatDays(v)}
          tick={(v) => String(v)}
        />
      ) : null}
    </div>
  );
}

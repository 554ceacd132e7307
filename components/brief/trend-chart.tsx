'use client';

import { Chart } from 'react-chartjs-2';
import { COLORS } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { formatMoney, formatMoneyShort } from '@/lib/runs/format';
import { dateText } from '@/lib/brief/format';
import type { TrendRow } from '@/lib/brief/trend';

/**
 * Approved baselines over the stage gates: base, P50 and P80 as lines on the left axis and
 * the P80 contingency as bars on the right axis, so that its drawdown reads at a glance.
 */
export function TrendChart({ rows, currency }: { rows: TrendRow[]; currency: string }) {
  const labels = rows.map((r) => [r.stage, dateText(r.decidedAt)]);
  const last = rows[rows.length - 1];
  const first = rows[0];
  const reading =
    rows.length > 1
      ? `Contingency at P80 went from ${formatMoney(first.contingencyP80, currency)} to ${formatMoney(last.contingencyP80, currency)} over ${rows.length} baselines.`
      : `One baseline so far: P80 ${formatMoney(last.p80, currency)}, contingency ${formatMoney(last.contingencyP80, currency)}.`;
  const line = (label: string, data: number[], color: string, dash?: number[]) => ({
    type: 'line' as const,
    label,
    data,
    borderColor: color,
    backgroundColor: color,
    borderDash: dash,
    pointRadius: 4,
    tension: 0,
    yAxisID: 'y',
  });
  return (
    <ChartFrame title="Approved baselines" reading={reading} height={300} testId="trend-chart">
      <Chart
        type="bar"
        aria-label="Base, P50 and P80 of each approved baseline, with the P80 contingency"
        role="img"
        data={{
          labels,
          datasets: [
            line(
              'P80',
              rows.map((r) => r.p80),
              COLORS.cost,
            ),
            line(
              'P50',
              rows.map((r) => r.p50),
              COLORS.time,
            ),
            line(
              'Base',
              rows.map((r) => r.base),
              COLORS.inkSoft,
              [4, 3],
            ),
            {
              type: 'bar' as const,
              label: 'Contingency at P80 (right axis)',
              data: rows.map((r) => r.contingencyP80),
              backgroundColor: 'rgba(183, 121, 31, 0.35)',
              borderColor: COLORS.caution,
              borderWidth: 1,
              yAxisID: 'y1',
              maxBarThickness: 36,
            },
          ],
        }}
        options={{
          maintainAspectRatio: false,
          interaction: { mode: 'index', intersect: false },
          plugins: {
            legend: { position: 'bottom' },
            tooltip: {
              callbacks: {
                label: (ctx) => `${ctx.dataset.label}: ${formatMoney(Number(ctx.parsed.y), currency)}`,
              },
            },
          },
          scales: {
            y: {
              // The lines sit far from zero; starting at zero would flatten the differences.
              beginAtZero: false,
              title: { display: true, text: `Total cost (${currency})` },
              ticks: { callback: (v) => formatMoneyShort(Number(v), currency) },
            },
            y1: {
              position: 'right',
              beginAtZero: true,
              grid: { drawOnChartArea: false },
              title: { display: true, text: `Contingency (${currency})` },
              ticks: { callback: (v) => formatMoneyShort(Number(v), currency) },
            },
          },
        }}
      />
    </ChartFrame>
  );
}

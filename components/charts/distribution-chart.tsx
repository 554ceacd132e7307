'use client';

import { Chart } from 'react-chartjs-2';
import type { ChartData, ChartOptions } from 'chart.js';
import type { Histogram, Point } from '@/lib/runs/outcome-data';
import { BOTTOM_LEGEND, linearAxis, POINTS_FRAME, PROBABILITY_AXIS } from './options';
import { COLORS, type Marker } from './setup';

/**
 * A histogram of the sampled iterations (bars, left axis) with the S-curve through the result's
 * percentiles (line, right axis) and labelled markers for P50, P80 and the target.
 */
export function DistributionChart({
  hist,
  curve,
  markers,
  color,
  colorLight,
  formatX,
  xTitle,
}: {
  hist: Histogram;
  curve: Point[];
  markers: Marker[];
  color: string;
  colorLight: string;
  formatX: (value: number) => string;
  xTitle: string;
}) {
  const bars = hist.counts.map((c, k) => ({ x: (hist.edges[k] + hist.edges[k + 1]) / 2, y: c / hist.n }));
  const data: ChartData<'bar' | 'line', Point[]> = {
    datasets: [
      {
        type: 'line',
        label: 'Cumulative probability (S-curve)',
        data: curve,
        borderColor: COLORS.ink,
        backgroundColor: COLORS.ink,
        borderWidth: 2,
        pointRadius: 2.5,
        cubicInterpolationMode: 'monotone',
        yAxisID: 'y2',
        order: 0,
      },
      {
        type: 'bar',
        label: 'Share of iterations',
        data: bars,
        backgroundColor: colorLight,
        borderColor: color,
        borderWidth: 1,
        barPercentage: 1,
        categoryPercentage: 1,
        yAxisID: 'y',
        order: 1,
      },
    ],
  };
  const options: ChartOptions<'bar' | 'line'> = {
    ...POINTS_FRAME,
    interaction: { mode: 'nearest', intersect: false },
    scales: {
      x: linearAxis(xTitle, formatX, 8),
      y: {
        ...linearAxis('Share of iterations (%)', (v) => (v * 100).toFixed(1)),
        position: 'left',
        beginAtZero: true,
      },
      y2: { ...PROBABILITY_AXIS, type: 'linear', position: 'right', grid: { drawOnChartArea: false } },
    },
    plugins: {
      legend: BOTTOM_LEGEND,
      tooltip: {
        callbacks: {
          title: (items) => formatX(items[0].parsed.x ?? 0),
          label: (item) =>
            item.dataset.yAxisID === 'y2'
              ? `${Math.round((item.parsed.y ?? 0) * 100)} % of outcomes at or below`
              : `${((item.parsed.y ?? 0) * 100).toFixed(1)} % of iterations in this bin`,
        },
      },
      // Read by the marker plugin (components/charts/setup.ts).
      ...({ markers: { lines: markers } } as object),
    },
  };
  return (
    <Chart type="bar" data={data as unknown as ChartData<'bar'>} options={options as ChartOptions<'bar'>} />
  );
}

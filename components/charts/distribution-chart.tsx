'use client';

import { Chart } from 'react-chartjs-2';
import type { ChartData, ChartOptions } from 'chart.js';
import type { Histogram, Point } from '@/lib/runs/outcome-data';
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
    responsive: true,
    maintainAspectRatio: false,
    parsing: false,
    interaction: { mode: 'nearest', intersect: false },
    scales: {
      x: {
        type: 'linear',
        title: { display: true, text: xTitle },
        ticks: { callback: (v) => formatX(Number(v)), maxTicksLimit: 8 },
      },
      y: {
        type: 'linear',
        position: 'left',
        beginAtZero: true,
        title: { display: true, text: 'Share of iterations (%)' },
        ticks: { callback: (v) => `${(Number(v) * 100).toFixed(1)}` },
      },
      y2: {
        type: 'linear',
        position: 'right',
        min: 0,
        max: 1,
        grid: { drawOnChartArea: false },
        title: { display: true, text: 'Cumulative probability (%)' },
        ticks: { callback: (v) => `${Math.round(Number(v) * 100)}` },
      },
    },
    plugins: {
      legend: { position: 'bottom', labels: { boxWidth: 12 } },
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

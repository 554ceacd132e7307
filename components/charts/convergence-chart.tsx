'use client';

import { Line } from 'react-chartjs-2';
import type { ChartData, ChartOptions } from 'chart.js';
import type { ConvergenceSeries } from '@/lib/sim';
import { BOTTOM_LEGEND, linearAxis, POINTS_FRAME, titled } from './options';
import { COLORS } from './setup';

/** Running P50 and P80 as the iterations accumulate, each inside its 95% interval band. */
export function ConvergenceChart({
  iterations,
  series,
  color,
  band,
  formatY,
  yTitle,
}: {
  iterations: number[];
  series: ConvergenceSeries;
  color: string;
  band: string;
  formatY: (v: number) => string;
  yTitle: string;
}) {
  const pts = (ys: number[]) => ys.map((y, i) => ({ x: iterations[i], y }));
  const edge = { borderWidth: 0, pointRadius: 0, backgroundColor: band };
  const data: ChartData<'line', { x: number; y: number }[]> = {
    datasets: [
      { ...edge, label: 'P80 interval high', data: pts(series.P80ci95.map((c) => c[1])), fill: false },
      { ...edge, label: 'P80 95 % interval', data: pts(series.P80ci95.map((c) => c[0])), fill: '-1' },
      { label: 'P80', data: pts(series.P80), borderColor: color, borderWidth: 2, pointRadius: 0 },
      { ...edge, label: 'P50 interval high', data: pts(series.P50ci95.map((c) => c[1])), fill: false },
      { ...edge, label: 'P50 95 % interval', data: pts(series.P50ci95.map((c) => c[0])), fill: '-1' },
      { label: 'P50', data: pts(series.P50), borderColor: COLORS.ink, borderWidth: 2, pointRadius: 0 },
    ],
  };
  const options: ChartOptions<'line'> = {
    ...POINTS_FRAME,
    interaction: { mode: 'index', intersect: false },
    scales: {
      x: linearAxis('Iterations', (v) => v.toLocaleString('en-GB')),
      y: { title: titled(yTitle), ticks: { callback: (v) => formatY(Number(v)) } },
    },
    plugins: {
      legend: {
        ...BOTTOM_LEGEND,
        labels: { ...BOTTOM_LEGEND.labels, filter: (item) => !item.text.includes('interval high') },
      },
      tooltip: {
        filter: (item) => item.dataset.label === 'P50' || item.dataset.label === 'P80',
        callbacks: { label: (item) => `${item.dataset.label}: ${formatY(item.parsed.y ?? 0)}` },
      },
    },
  };
  return <Line data={data} options={options} />;
}

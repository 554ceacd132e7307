'use client';

import { Bar } from 'react-chartjs-2';
import type { ChartOptions } from 'chart.js';
import { COLORS } from './setup';

/** Share of iterations in which each activity was on the critical path. */
export function CriticalityChart({ rows }: { rows: { label: string; value: number }[] }) {
  const options: ChartOptions<'bar'> = {
    indexAxis: 'y',
    responsive: true,
    maintainAspectRatio: false,
    scales: {
      x: {
        min: 0,
        max: 1,
        title: { display: true, text: 'Iterations on the critical path (%)' },
        ticks: { callback: (v) => `${Math.round(Number(v) * 100)}` },
      },
      y: { ticks: { autoSkip: false } },
    },
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: { label: (item) => `${((item.parsed.x ?? 0) * 100).toFixed(1)} % of iterations` },
      },
    },
  };
  return (
    <Bar
      data={{
        labels: rows.map((r) => r.label),
        datasets: [{ label: 'Criticality', data: rows.map((r) => r.value), backgroundColor: COLORS.time }],
      }}
      options={options}
    />
  );
}

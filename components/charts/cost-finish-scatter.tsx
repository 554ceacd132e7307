'use client';

import { Scatter } from 'react-chartjs-2';
import type { ChartOptions } from 'chart.js';
import { COLORS, type Marker } from './setup';

/** One dot per sampled iteration: its duration (x) against its cost (y), with both targets. */
export function CostFinishScatter({
  points,
  markers,
  formatX,
  formatY,
}: {
  points: { x: number; y: number }[];
  markers: Marker[];
  formatX: (v: number) => string;
  formatY: (v: number) => string;
}) {
  const options: ChartOptions<'scatter'> = {
    responsive: true,
    maintainAspectRatio: false,
    parsing: false,
    scales: {
      x: {
        type: 'linear',
        title: { display: true, text: 'Finish (date; working days from the base date)' },
        ticks: { callback: (v) => formatX(Number(v)), maxTicksLimit: 7 },
      },
      y: { title: { display: true, text: 'Total cost' }, ticks: { callback: (v) => formatY(Number(v)) } },
    },
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: { label: (item) => `${formatX(item.parsed.x ?? 0)} · ${formatY(item.parsed.y ?? 0)}` },
      },
      ...({ markers: { lines: markers } } as object),
    },
  };
  return (
    <Scatter
      data={{
        datasets: [
          {
            label: 'Iterations',
            data: points,
            pointRadius: 1.6,
            backgroundColor: 'rgba(22, 96, 122, 0.35)',
            borderWidth: 0,
          },
        ],
      }}
      options={options}
    />
  );
}

export const TARGET_COLOR = COLORS.caution;

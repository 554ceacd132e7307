'use client';

import { Scatter } from 'react-chartjs-2';
import type { ChartOptions } from 'chart.js';
import { COLORS, type Marker } from './setup';
import { linearAxis, POINTS_FRAME, titled } from './options';

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
    ...POINTS_FRAME,
    scales: {
      x: linearAxis('Finish (date; working days from the base date)', formatX, 7),
      y: { title: titled('Total cost'), ticks: { callback: (v) => formatY(Number(v)) } },
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

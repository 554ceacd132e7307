'use client';

import { Line } from 'react-chartjs-2';
import type { ChartOptions } from 'chart.js';
import type { Point } from '@/lib/runs/outcome-data';
import { BOTTOM_LEGEND, linearAxis, POINTS_FRAME, PROBABILITY_AXIS } from './options';
import { COLORS } from './setup';

/** Two runs' S-curves on one axis. */
export function SCurveCompare({
  a,
  b,
  labels,
  formatX,
  xTitle,
}: {
  a: Point[];
  b: Point[];
  labels: [string, string];
  formatX: (v: number) => string;
  xTitle: string;
}) {
  const options: ChartOptions<'line'> = {
    ...POINTS_FRAME,
    interaction: { mode: 'nearest', intersect: false },
    scales: { x: linearAxis(xTitle, formatX), y: PROBABILITY_AXIS },
    plugins: {
      legend: BOTTOM_LEGEND,
      tooltip: {
        callbacks: {
          label: (item) =>
            `${item.dataset.label}: P${Math.round((item.parsed.y ?? 0) * 100)} = ${formatX(item.parsed.x ?? 0)}`,
        },
      },
    },
  };
  const line = (data: Point[], label: string, color: string, dash?: number[]) => ({
    label,
    data,
    borderColor: color,
    backgroundColor: color,
    borderWidth: 2,
    borderDash: dash,
    pointRadius: 2,
    cubicInterpolationMode: 'monotone' as const,
  });
  return (
    <Line
      data={{ datasets: [line(a, labels[0], COLORS.ink), line(b, labels[1], COLORS.compare, [5, 3])] }}
      options={options}
    />
  );
}

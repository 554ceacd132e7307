'use client';
// The swing chart: for each input, how far the total's mean moves when that input sits in its own
// low tenth and in its high tenth, in money or working days, widest first. The two halves are two
// tones of the side's colour, so an input that lowers the total when it is high reads at a glance.
import { Bar } from 'react-chartjs-2';
import type { ChartOptions } from 'chart.js';
import type { SwingRow } from '@/lib/runs/outcome-data';
import { ticksOver } from '@/lib/runs/chart-scale';
import { BOTTOM_LEGEND, FRAME, titled } from './options';

export function SwingChart({
  rows,
  labelOf,
  color,
  colorLight,
  formatChange,
  formatTick = formatChange,
  unit,
}: {
  rows: SwingRow[];
  labelOf: (r: SwingRow) => string;
  color: string;
  colorLight: string;
  /** A signed change from the mean, e.g. "+€1.2m". */
  formatChange: (v: number) => string;
  /** The axis's tick labels (rounder than the tooltips'); formatChange by default. */
  formatTick?: (v: number) => string;
  unit: string;
}) {
  const reach = Math.max(...rows.flatMap((r) => [Math.abs(r.low), Math.abs(r.high)]), 1e-9);
  const ticks = ticksOver(-reach, reach, 4);
  const limit = Math.max(-ticks.min, ticks.max);
  const options: ChartOptions<'bar'> = {
    ...FRAME,
    indexAxis: 'y',
    scales: {
      x: {
        min: -limit,
        max: limit,
        title: titled(`Change of the mean total (${unit}) with the input in its low or high tenth`),
        ticks: { stepSize: ticks.step, callback: (v) => formatTick(Number(v)) },
      },
      y: { ticks: { autoSkip: false, font: { size: 11 } } },
    },
    plugins: {
      legend: BOTTOM_LEGEND,
      tooltip: {
        callbacks: {
          label: (item) => {
            const r = rows[item.dataIndex];
            const v = item.datasetIndex === 0 ? r.low : r.high;
            return `${item.dataset.label}: ${formatChange(v)}`;
          },
        },
      },
    },
  };
  return (
    <Bar
      data={{
        labels: rows.map(labelOf),
        datasets: [
          {
            label: 'Input in its low tenth',
            data: rows.map((r) => [0, r.low] as [number, number]),
            backgroundColor: colorLight,
            borderColor: color,
            borderWidth: 1,
            barPercentage: 0.75,
            grouped: false,
          },
          {
            label: 'Input in its high tenth',
            data: rows.map((r) => [0, r.high] as [number, number]),
            backgroundColor: color,
            borderWidth: 0,
            barPercentage: 0.75,
            grouped: false,
          },
        ],
      }}
      options={options}
    />
  );
}

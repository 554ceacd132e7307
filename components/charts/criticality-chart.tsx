'use client';

import { Bar } from 'react-chartjs-2';
import { horizontalBarOptions, wholePercent } from './options';
import { COLORS } from './setup';

/** Share of iterations in which each activity was on the critical path. */
export function CriticalityChart({ rows }: { rows: { label: string; value: number }[] }) {
  const options = horizontalBarOptions(
    { min: 0, max: 1, title: 'Iterations on the critical path (%)', ticks: { callback: wholePercent } },
    (item) => `${((item.parsed.x ?? 0) * 100).toFixed(1)} % of iterations`,
  );
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

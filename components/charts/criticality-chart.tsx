'use client';

import { Bar } from 'react-chartjs-2';
import { BOTTOM_LEGEND, horizontalBarOptions, wholePercent } from './options';
import { COLORS } from './setup';

/**
 * Share of iterations in which each activity was on the critical path and, beside it where the
 * result holds one, its schedule sensitivity index (criticality × sd(activity) / sd(project)).
 */
export function CriticalityChart({
  rows,
}: {
  rows: { label: string; criticality: number; ssi: number | null }[];
}) {
  const withSsi = rows.some((r) => r.ssi !== null);
  const top = Math.max(1, ...rows.map((r) => r.ssi ?? 0));
  const options = horizontalBarOptions(
    {
      min: 0,
      max: Math.ceil(top * 10) / 10,
      title: withSsi ? 'Criticality and sensitivity index (%)' : 'Iterations on the critical path (%)',
      ticks: { callback: wholePercent, stepSize: 0.2 },
    },
    (item) =>
      item.datasetIndex === 0
        ? `on the critical path in ${((item.parsed.x ?? 0) * 100).toFixed(1)} % of iterations`
        : `schedule sensitivity index ${((item.parsed.x ?? 0) * 100).toFixed(1)} %`,
  );
  if (withSsi) options.plugins = { ...options.plugins, legend: BOTTOM_LEGEND };
  return (
    <Bar
      data={{
        labels: rows.map((r) => r.label),
        datasets: [
          {
            label: 'Criticality',
            data: rows.map((r) => r.criticality),
            backgroundColor: COLORS.time,
            barPercentage: 0.9,
          },
          ...(withSsi
            ? [
                {
                  label: 'Schedule sensitivity index',
                  data: rows.map((r) => r.ssi ?? 0),
                  backgroundColor: COLORS.timeLight,
                  borderColor: COLORS.time,
                  borderWidth: 1,
                  barPercentage: 0.9,
                },
              ]
            : []),
        ],
      }}
      options={options}
    />
  );
}

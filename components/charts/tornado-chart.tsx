'use client';

import { Bar } from 'react-chartjs-2';
import type { SensitivityEntry } from '@/lib/sim';
import { horizontalBarOptions } from './options';
import { COLORS } from './setup';

/** Drivers as horizontal bars of their rank correlation with the total, strongest on top. */
export function TornadoChart({
  entries,
  nameOf,
  color,
}: {
  entries: SensitivityEntry[];
  nameOf: (id: string) => string;
  color: string;
}) {
  const labels = entries.map((e) => {
    const name = nameOf(e.id);
    const short = name.length > 34 ? `${name.slice(0, 33)}…` : name;
    return `${e.id}${short && short !== e.id ? ` ${short}` : ''} · ${Math.round(e.varianceShare * 100)} %`;
  });
  const options = horizontalBarOptions(
    { min: -1, max: 1, title: 'Rank correlation with the total (−1 to 1)', ticks: { stepSize: 0.25 } },
    (item) => {
      const e = entries[item.dataIndex];
      return `rank correlation ${e.rankCorrelation.toFixed(2)}, ${(e.varianceShare * 100).toFixed(1)} % of the variance`;
    },
    { font: { size: 11 } },
  );
  return (
    <Bar
      data={{
        labels,
        datasets: [
          {
            label: 'Rank correlation',
            data: entries.map((e) => e.rankCorrelation),
            backgroundColor: entries.map((e) => (e.rankCorrelation >= 0 ? color : COLORS.rule)),
            borderColor: color,
            borderWidth: 1,
            barPercentage: 0.8,
          },
        ],
      }}
      options={options}
    />
  );
}

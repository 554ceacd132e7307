'use client';
// The rank view of what drives a total: each input's rank correlation with it, as bars from 0. When
// every input pushes the same way the axis is a half axis from 0, not an empty mirrored half.
import { Bar } from 'react-chartjs-2';
import type { SensitivityEntry } from '@/lib/sim';
import { signedAxis } from '@/lib/runs/chart-scale';
import { horizontalBarOptions } from './options';
import { COLORS } from './setup';

export function RankChart({
  entries,
  labelOf,
  color,
}: {
  entries: SensitivityEntry[];
  labelOf: (e: SensitivityEntry) => string;
  color: string;
}) {
  const axis = signedAxis(entries.map((e) => e.rankCorrelation));
  const options = horizontalBarOptions(
    {
      min: axis.min,
      max: axis.max,
      title:
        axis.half === 'positive'
          ? 'Rank correlation with the total (0 to 1; every input here raises it)'
          : axis.half === 'negative'
            ? 'Rank correlation with the total (−1 to 0; every input here lowers it)'
            : 'Rank correlation with the total (−1 to 1)',
      ticks: {
        stepSize: axis.step,
        callback: (v: number | string) => {
          const n = Number(v);
          return n === 0 ? '0' : `${n < 0 ? '−' : ''}${Math.abs(n).toFixed(axis.step < 0.1 ? 2 : 1)}`;
        },
      },
    },
    (item) => {
      const e = entries[item.dataIndex];
      return `rank correlation ${e.rankCorrelation.toFixed(2)}; ${(e.varianceShare * 100).toFixed(1)} % of the explained rank variance`;
    },
    { font: { size: 11 } },
  );
  return (
    <Bar
      data={{
        labels: entries.map(labelOf),
        datasets: [
          {
            label: 'Rank correlation',
            data: entries.map((e) => e.rankCorrelation),
            backgroundColor: entries.map((e) => (e.rankCorrelation >= 0 ? color : COLORS.rule)),
            borderColor: color,
            borderWidth: 1,
            barPercentage: 0.75,
          },
        ],
      }}
      options={options}
    />
  );
}

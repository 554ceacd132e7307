'use client';
// The cost side and the finish side of an outcome draw the same kinds of chart: each frame here
// takes its side and derives the colours, titles and test ids from it.
import { COLORS, type Marker } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { ConvergenceChart } from '@/components/charts/convergence-chart';
import { DistributionChart } from '@/components/charts/distribution-chart';
import { TornadoChart } from '@/components/charts/tornado-chart';
import type { SensitivityEntry, SimulationResult, TotalSummary } from '@/lib/sim';
import { percentileCurve, topDrivers, type SampleCharts } from '@/lib/runs/outcome-data';

export type Side = 'cost' | 'duration';

/** One side of the outcome: its summary, target, and how its values read on an axis. */
export type SideView = {
  side: Side;
  summary: TotalSummary;
  target: number | null;
  format: (v: number) => string;
  axisTitle: string;
};

const TONES = {
  cost: { color: COLORS.cost, light: COLORS.costLight, band: COLORS.costBand },
  duration: { color: COLORS.time, light: COLORS.timeLight, band: COLORS.timeBand },
};
const DISTRIBUTION = {
  cost: { title: 'Total cost: distribution and S-curve', testId: 'chart-cost-histogram' },
  duration: { title: 'Finish date: distribution and S-curve', testId: 'chart-finish-curve' },
};
const EMPTY_HISTOGRAM = { edges: [], counts: [], n: 1 };

/** P50, P80 and the target (when set) as labelled chart markers. */
function levelMarkers({ side, summary, target, format }: SideView): Marker[] {
  const marker = (value: number, label: string, color: string, dash?: number[]): Marker => ({
    value,
    label: `${label} ${format(value)}`,
    color,
    dash,
  });
  return [
    marker(summary.percentiles.P50, 'P50', COLORS.ink, [4, 3]),
    marker(summary.percentiles.P80, 'P80', TONES[side].color),
    ...(target !== null ? [marker(target, 'Target', COLORS.caution, [2, 2])] : []),
  ];
}

/** The histogram of the sampled iterations with the S-curve and the level markers. */
export function DistributionFrame({
  view,
  charts,
  reading,
  note,
}: {
  view: SideView;
  charts: SampleCharts | null;
  reading: string;
  note: string;
}) {
  const tone = TONES[view.side];
  return (
    <ChartFrame {...DISTRIBUTION[view.side]} reading={reading} note={note} height={300}>
      <DistributionChart
        hist={charts?.[view.side] ?? EMPTY_HISTOGRAM}
        curve={percentileCurve(view.summary)}
        markers={levelMarkers(view)}
        color={tone.color}
        colorLight={tone.light}
        formatX={view.format}
        xTitle={view.axisTitle}
      />
    </ChartFrame>
  );
}

/** The strongest drivers of one side, or why there are none. */
export function DriversFrame({
  side,
  entries,
  nameOf,
  reading,
  empty,
}: {
  side: Side;
  entries: SensitivityEntry[];
  nameOf: (id: string) => string;
  /** The reading, given the strongest driver's code and name. */
  reading: (strongest: string) => string;
  empty: string;
}) {
  const top = topDrivers(entries);
  return (
    <ChartFrame
      title={`${side === 'cost' ? 'Cost' : 'Duration'} drivers (top 15)`}
      testId={`chart-tornado-${side}`}
      reading={top.length ? reading(`${top[0].id} ${nameOf(top[0].id)}`) : empty}
      height={Math.max(160, top.length * 22 + 50)}
    >
      <TornadoChart entries={top} nameOf={nameOf} color={TONES[side].color} />
    </ChartFrame>
  );
}

/** How one side's P50 and P80 settled as the iterations accumulated; nothing without a series. */
export function ConvergenceFrame({
  side,
  convergence,
  reading,
  formatY,
  yTitle,
}: {
  side: Side;
  convergence: SimulationResult['convergence'];
  reading: string;
  formatY: (v: number) => string;
  yTitle: string;
}) {
  const series = convergence[side];
  if (!series) return null;
  return (
    <ChartFrame
      title={`Convergence of ${side} P50 and P80`}
      testId={`chart-convergence-${side}`}
      reading={reading}
      height={240}
    >
      <ConvergenceChart
        iterations={convergence.iterations}
        series={series}
        color={TONES[side].color}
        band={TONES[side].band}
        formatY={formatY}
        yTitle={yTitle}
      />
    </ChartFrame>
  );
}

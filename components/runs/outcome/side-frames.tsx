'use client';
// The cost side and the finish side of an outcome draw the same kinds of chart: each frame here
// takes its side and derives the colours, titles and test ids from it.
import { COLORS } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { ConvergenceChart } from '@/components/charts/convergence-chart';
import { SCurveStrip, S_CURVE_HEIGHT, type Curve } from '@/components/charts/s-curve-strip';
import { RankChart } from '@/components/charts/rank-chart';
import { SwingChart } from '@/components/charts/swing-chart';
import type {
  MitigationResult,
  PercentileKey,
  SensitivityEntry,
  SimulationResult,
  TotalSummary,
} from '@/lib/sim';
import { PERCENTILE_KEYS, probabilityOf } from '@/lib/domain/percentiles';
import { placement } from '@/lib/runs/chart-scale';
import { formatChange } from '@/lib/runs/format';
import {
  KIND_LABEL,
  percentileCurve,
  responseValueAt,
  scenarioCurve,
  swingRows,
  topDrivers,
  type Histogram,
  type SwingRow,
} from '@/lib/runs/outcome-data';

export type Side = 'cost' | 'duration';

/** One side of the outcome: its summary, target, and how its values read on an axis. */
export type SideView = {
  side: Side;
  summary: TotalSummary;
  target: number | null;
  format: (v: number) => string;
  /** An amount of the same unit (a difference or a contingency): money, or working days. */
  formatAmount: (v: number) => string;
  axisTitle: string;
};

export const TONES = {
  cost: { color: COLORS.cost, light: COLORS.costLight, band: COLORS.costBand },
  duration: { color: COLORS.time, light: COLORS.timeLight, band: COLORS.timeBand },
};
const CURVE = {
  cost: { title: 'Total cost: S-curve', testId: 'chart-cost-histogram' },
  duration: { title: 'Finish date: S-curve', testId: 'chart-finish-curve' },
};
const KEY_LEVELS: PercentileKey[] = PERCENTILE_KEYS.filter((k) => k !== 'P5' && k !== 'P95');

/** The scenario pair of one side, when the result holds both. */
function scenariosOf(mitigation: MitigationResult | undefined, side: Side) {
  const pre = mitigation?.pre[side];
  const post = mitigation?.post[side];
  return mitigation && pre && post ? { used: mitigation.used, pre, post } : null;
}

/**
 * The S-curve with the density strip beneath and, beside it, the P-levels as a key (both
 * scenarios' when there are two); the responses' effect at the chosen level drawn as a bar.
 */
export function SCurveFrame({
  view,
  strip,
  mitigation,
  level,
  reading,
  note,
}: {
  view: SideView;
  strip: Histogram | null;
  mitigation: MitigationResult | undefined;
  level: PercentileKey;
  reading: string;
  note: string;
}) {
  const tone = TONES[view.side];
  const pair = scenariosOf(mitigation, view.side);
  const curves: Curve[] = pair
    ? [
        { label: 'After the responses', points: scenarioCurve(pair.post.percentiles), color: tone.color },
        {
          label: 'Before the responses',
          points: scenarioCurve(pair.pre.percentiles),
          color: COLORS.inkSoft,
          dash: '5 4',
        },
      ]
    : [{ label: 'All iterations', points: percentileCurve(view.summary), color: tone.color }];
  if (pair && pair.used === 'pre') curves.reverse();
  const effect = pair ? responseValueAt(pair.pre.percentiles, pair.post.percentiles, level) : null;
  const targetNote = view.target === null ? null : targetOffRange(view.target, curves, view.format);
  return (
    <ChartFrame
      {...CURVE[view.side]}
      reading={reading}
      note={
        <>
          {note}
          {pair ? ' The scenarios keep their P5 to P95, so their curves end there.' : ''}
          {targetNote ? <span className="block text-caution-dark">{targetNote}</span> : null}
        </>
      }
      height={S_CURVE_HEIGHT}
    >
      <div className="flex h-full gap-3">
        <div className="min-w-0 flex-1">
          <SCurveStrip
            curves={curves}
            strip={strip}
            color={tone.color}
            target={
              view.target !== null
                ? { value: view.target, label: `Target ${view.format(view.target)}` }
                : null
            }
            gap={
              effect && Math.abs(effect.saving) > 0
                ? {
                    level: probabilityOf(level),
                    from: effect.pre,
                    to: effect.post,
                    label: `${level} ${formatChange(effect.post - effect.pre, view.formatAmount)}`,
                  }
                : null
            }
            formatX={view.format}
            xTitle={view.axisTitle}
          />
        </div>
        <LevelKey view={view} pair={pair} curves={curves} level={level} />
      </div>
    </ChartFrame>
  );
}

/** A target beyond every drawn value is said in words, never dropped in silence. */
function targetOffRange(target: number, curves: Curve[], format: (v: number) => string): string | null {
  const xs = curves.flatMap((c) => c.points.map((p) => p.x));
  const where = placement(target, { min: Math.min(...xs), max: Math.max(...xs) });
  if (where === 'inside') return null;
  return where === 'above'
    ? `The target ${format(target)} lies above every outcome drawn, off the right of the chart.`
    : `The target ${format(target)} lies below every outcome drawn, off the left of the chart.`;
}

/** The key beside the S-curve: each level's value, per scenario when there are two. */
function LevelKey({
  view,
  pair,
  curves,
  level,
}: {
  view: SideView;
  pair: ReturnType<typeof scenariosOf>;
  curves: Curve[];
  level: PercentileKey;
}) {
  const swatch = (c: Curve) => (
    <svg width="18" height="8" aria-hidden className="inline-block">
      <line x1="0" x2="18" y1="4" y2="4" stroke={c.color} strokeWidth="2" strokeDasharray={c.dash} />
    </svg>
  );
  return (
    <table className="h-fit w-auto shrink-0 border-collapse text-xs" data-testid={`${view.side}-level-key`}>
      <thead className="text-ink-soft">
        <tr className="border-b border-rule">
          <th className="py-0.5 pr-2 text-left font-medium">Level</th>
          {curves.map((c) => (
            <th key={c.label} className="py-0.5 pl-2 text-right font-medium" title={c.label}>
              {swatch(c)} {pair ? (c.label.startsWith('After') ? 'After' : 'Before') : 'Value'}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {KEY_LEVELS.map((k) => (
          <tr key={k} className={k === level ? 'font-semibold text-ink' : 'text-ink-soft'}>
            <td className="py-0.5 pr-2">{k}</td>
            {curves.map((c) => {
              const v = pair
                ? (c.label.startsWith('After') ? pair.post : pair.pre).percentiles[k]
                : view.summary.percentiles[k];
              return (
                <td key={c.label} className="num py-0.5 pl-2">
                  {view.format(v)}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** "C3 Dredging · line item": code, name cut to fit, and the kind where the result says it. */
export function inputLabel(id: string, kind: SensitivityEntry['kind'], nameOf: (id: string) => string) {
  const name = nameOf(id);
  const short = name.length > 28 ? `${name.slice(0, 27)}…` : name;
  return `${id}${short && short !== id ? ` ${short}` : ''}${kind ? ` · ${KIND_LABEL[kind]}` : ''}`;
}

const rowHeight = (rows: number) => Math.max(160, rows * 24 + 70);

/** The swing of one side's total, widest first; why there is none for a version 1 result. */
export function SwingFrame({
  side,
  entries,
  mean,
  nameOf,
  formatDelta,
  formatTick,
  unit,
}: {
  side: Side;
  entries: SensitivityEntry[];
  mean: number;
  nameOf: (id: string) => string;
  formatDelta: (v: number) => string;
  formatTick?: (v: number) => string;
  unit: string;
}) {
  const rows = swingRows(entries, mean);
  const label = (r: SwingRow) => inputLabel(r.id, r.kind, nameOf);
  const what = side === 'cost' ? 'total cost' : 'duration';
  if (!rows.length) {
    return (
      <ChartFrame
        title={`Swing of the ${what}`}
        testId={`chart-swing-${side}`}
        reading={
          entries.length
            ? 'This run was made before results held swings; run it again to see them.'
            : `No uncertain input moves the ${what}.`
        }
        height={0}
      >
        {null}
      </ChartFrame>
    );
  }
  const first = rows[0];
  return (
    <ChartFrame
      title={`Swing of the ${what} (the ${rows.length} widest)`}
      testId={`chart-swing-${side}`}
      reading={`With ${first.id} ${nameOf(first.id)} in its low tenth the mean ${what} moves by ${formatDelta(first.low)}, in its high tenth by ${formatDelta(first.high)}.`}
      note={`Each bar: the mean ${what} over the iterations where that input's own sample is in its lowest or highest tenth, less the mean of all iterations.`}
      height={rowHeight(rows.length)}
    >
      <SwingChart
        rows={rows}
        labelOf={label}
        color={TONES[side].color}
        colorLight={TONES[side].light}
        formatChange={formatDelta}
        formatTick={formatTick}
        unit={unit}
      />
    </ChartFrame>
  );
}

/** The strongest drivers of one side by rank correlation, or why there are none. */
export function RankFrame({
  side,
  entries,
  nameOf,
}: {
  side: Side;
  entries: SensitivityEntry[];
  nameOf: (id: string) => string;
}) {
  const top = topDrivers(entries);
  const what = side === 'cost' ? 'total cost' : 'duration';
  return (
    <ChartFrame
      title={`Rank correlation with the ${what} (top ${top.length})`}
      testId={`chart-rank-${side}`}
      reading={
        top.length
          ? `${top[0].id} ${nameOf(top[0].id)} ranks most closely with the ${what} (${top[0].rankCorrelation.toFixed(2)}).`
          : `No uncertain input moves the ${what}.`
      }
      note="Tooltips give each input's share of the explained rank variance: a first-order share that ignores interactions, not a share of money."
      height={rowHeight(top.length)}
    >
      {top.length ? (
        <RankChart
          entries={top}
          labelOf={(e) => inputLabel(e.id, e.kind, nameOf)}
          color={TONES[side].color}
        />
      ) : null}
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

// Option pieces the charts share: the frame-filling base, titled axes, the cumulative
// probability axis, the legend below the plot, and horizontal bar charts.
import type { ChartOptions, TooltipItem } from 'chart.js';

/** Fills its frame (the frame sets the height). */
export const FRAME = { responsive: true, maintainAspectRatio: false } as const;

/** Fills its frame; the data come as {x, y} points, read as they are. */
export const POINTS_FRAME = { ...FRAME, parsing: false } as const;

/** An axis title that is shown. */
export const titled = (text: string) => ({ display: true, text });

/** A linear axis with its title and tick labels written by `format`. */
export function linearAxis(title: string, format: (v: number) => string, maxTicksLimit?: number) {
  return {
    type: 'linear' as const,
    title: titled(title),
    ticks: {
      callback: (v: number | string) => format(Number(v)),
      ...(maxTicksLimit ? { maxTicksLimit } : {}),
    },
  };
}

/** A 0–1 share, labelled in whole per cent. */
export const wholePercent = (v: number | string) => `${Math.round(Number(v) * 100)}`;

/** The 0–1 axis of cumulative probability, labelled in per cent. */
export const PROBABILITY_AXIS = {
  min: 0,
  max: 1,
  title: titled('Cumulative probability (%)'),
  ticks: { callback: wholePercent },
};

export const BOTTOM_LEGEND = { position: 'bottom' as const, labels: { boxWidth: 12 } };

/** Horizontal bars, one row per label (every label shown), no legend, with a tooltip line. */
export function horizontalBarOptions(
  x: { min: number; max: number; title: string; ticks: Record<string, unknown> },
  label: (item: TooltipItem<'bar'>) => string,
  yTicks: Record<string, unknown> = {},
): ChartOptions<'bar'> {
  return {
    ...FRAME,
    indexAxis: 'y',
    scales: {
      x: { min: x.min, max: x.max, title: titled(x.title), ticks: x.ticks },
      y: { ticks: { autoSkip: false, ...yTicks } },
    },
    plugins: { legend: { display: false }, tooltip: { callbacks: { label } } },
  };
}

/**
 * Geometry of the brief's two charts (S-curve and tornado) in plain coordinates, shared by
 * the SVG on the page and the vector drawing in the PDF so that both show the same picture.
 * y grows downwards, as in SVG and PDF page space.
 */

export type Box = { x: number; y: number; width: number; height: number };
export type Tick = { value: number; at: number };

/**
 * About `count` round tick values covering [min, max]: steps of 1, 2 or 5 × 10^k, the usual
 * "nice numbers" choice (Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990).
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (max < min) [min, max] = [max, min];
  if (max === min) {
    const pad = Math.abs(min) * 0.05 || 1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / Math.max(1, count);
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ?? 10 * magnitude;
  const first = Math.floor(min / step) * step;
  const ticks: number[] = [];
  for (let v = first; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  if (ticks[ticks.length - 1] < max) ticks.push(Number((ticks[ticks.length - 1] + step).toPrecision(12)));
  return ticks;
}

/** A linear map from [d0, d1] onto [r0, r1]. */
export function linearScale(d0: number, d1: number, r0: number, r1: number) {
  const span = d1 - d0 || 1;
  return (v: number) => r0 + ((v - d0) / span) * (r1 - r0);
}

export type SCurveGeometry = {
  /** The plotting area inside the box (axes run along its left and bottom edges). */
  plot: Box;
  line: { x: number; y: number }[];
  xTicks: Tick[];
  yTicks: Tick[];
  /**
   * Vertical guides at chosen values (e.g. base, P80, the target), clipped to the plot; `row` is
   * the line their label sits on (0 first), so that labels of close guides do not overprint.
   */
  markers: { label: string; value: number; at: number; row: number }[];
};

/**
 * The cumulative curve: x the amount, y the share of outcomes at or below it (0–1).
 * `margin` leaves room for tick labels on the left and below.
 */
export function sCurveGeometry(
  points: { x: number; y: number }[],
  box: Box,
  markers: { label: string; value: number }[] = [],
  margin = { left: 44, bottom: 22, top: 8, right: 10 },
): SCurveGeometry {
  const plot: Box = {
    x: box.x + margin.left,
    y: box.y + margin.top,
    width: box.width - margin.left - margin.right,
    height: box.height - margin.top - margin.bottom,
  };
  const xs = [...points.map((p) => p.x), ...markers.map((m) => m.value)].filter(Number.isFinite);
  const ticks = niceTicks(Math.min(...xs), Math.max(...xs), 5);
  const x0 = ticks[0] ?? 0;
  const x1 = ticks[ticks.length - 1] ?? 1;
  const sx = linearScale(x0, x1, plot.x, plot.x + plot.width);
  const sy = linearScale(0, 1, plot.y + plot.height, plot.y);
  return {
    plot,
    line: points.map((p) => ({ x: sx(p.x), y: sy(p.y) })),
    xTicks: ticks.map((value) => ({ value, at: sx(value) })),
    yTicks: [0, 0.2, 0.4, 0.6, 0.8, 1].map((value) => ({ value, at: sy(value) })),
    markers: labelRows(
      markers.filter((m) => m.value >= x0 && m.value <= x1).map((m) => ({ ...m, at: sx(m.value) })),
    ),
  };
}

/** Room a marker's label takes along x, in the drawing's units. */
const LABEL_ROOM = 44;

/** Gives each marker the first label line on which it keeps LABEL_ROOM from the labels before it. */
function labelRows<M extends { at: number }>(markers: M[]): (M & { row: number })[] {
  const lastAt: number[] = [];
  return [...markers]
    .sort((a, b) => a.at - b.at)
    .map((m) => {
      let row = lastAt.findIndex((at) => m.at - at >= LABEL_ROOM);
      if (row < 0) row = lastAt.length;
      lastAt[row] = m.at;
      return { ...m, row };
    });
}

export type TornadoBar = {
  label: string;
  value: number;
  x: number;
  y: number;
  width: number;
  height: number;
};

export type TornadoGeometry = {
  plot: Box;
  /** x of the zero line. */
  zero: number;
  bars: TornadoBar[];
  ticks: Tick[];
};

/**
 * Horizontal bars from a zero line, one row per driver in the given order. The axis runs to the
 * largest |value| rounded up to a tenth (values are rank correlations in [−1, 1]): on both sides
 * when drivers push both ways, on one side only (a half axis) when every driver pushes the same
 * way, so that no half of the plot stands empty. `labelWidth` leaves room for the names.
 */
export function tornadoGeometry(
  drivers: { label: string; value: number }[],
  box: Box,
  labelWidth = 150,
  bottom = 20,
): TornadoGeometry {
  const plot: Box = {
    x: box.x + labelWidth,
    y: box.y,
    width: box.width - labelWidth - 18, // room for the last tick label
    height: box.height - bottom,
  };
  const largest = Math.max(0.1, ...drivers.map((d) => Math.abs(d.value)));
  const both = drivers.some((d) => d.value < 0) && drivers.some((d) => d.value > 0);
  // A half axis ticks every 0.1 up to 0.5, else every 0.2, and ends on a tick.
  const step = largest <= 0.5 ? 0.1 : 0.2;
  const limit = both
    ? Math.min(1, Math.ceil(largest * 10 - 1e-9) / 10)
    : Math.min(1, Math.ceil(largest / step - 1e-9) * step);
  const negative =
    drivers.length > 0 && drivers.every((d) => d.value <= 0) && drivers.some((d) => d.value < 0);
  const lo = both || negative ? -limit : 0;
  const hi = negative ? 0 : limit;
  const sx = linearScale(lo, hi, plot.x, plot.x + plot.width);
  const zero = sx(0);
  const row = drivers.length ? plot.height / drivers.length : 0;
  const bars = drivers.map((d, i) => {
    const end = sx(Math.max(lo, Math.min(hi, d.value)));
    return {
      label: d.label,
      value: d.value,
      x: Math.min(zero, end),
      y: plot.y + i * row + row * 0.15,
      width: Math.abs(end - zero),
      height: row * 0.7,
    };
  });
  const tickValues = both
    ? [-limit, -limit / 2, 0, limit / 2, limit]
    : Array.from({ length: Math.round(limit / step) + 1 }, (_, k) => lo + k * step);
  const ticks = tickValues.map((value) => ({
    value: Number(value.toPrecision(6)),
    at: sx(value),
  }));
  return { plot, zero, bars, ticks };
}

export type Xy = { x: number; y: number };
export type CubicSegment = { c1: Xy; c2: Xy; to: Xy };

/**
 * A smooth curve through points with increasing x that never overshoots them: monotone cubic
 * Hermite interpolation with the Fritsch–Carlson tangents (F. N. Fritsch and R. E. Carlson,
 * "Monotone Piecewise Cubic Interpolation", SIAM J. Numer. Anal. 17(2), 1980), written as cubic
 * Bézier segments (control points at a third of each interval along the tangents). A cumulative
 * curve drawn this way stays a cumulative curve: it never falls between two of its points.
 * Points that repeat an x are dropped (the first is kept).
 */
export function monotoneCubic(points: readonly Xy[]): { start: Xy | null; segments: CubicSegment[] } {
  const p = points.filter((q, i) => i === 0 || q.x > points[i - 1].x);
  if (!p.length) return { start: null, segments: [] };
  const n = p.length;
  const slope: number[] = [];
  for (let i = 0; i < n - 1; i++) slope.push((p[i + 1].y - p[i].y) / (p[i + 1].x - p[i].x));
  const m: number[] = p.map((_, i) => {
    if (i === 0) return slope[0] ?? 0;
    if (i === n - 1) return slope[n - 2];
    return slope[i - 1] * slope[i] <= 0 ? 0 : (slope[i - 1] + slope[i]) / 2;
  });
  // Fritsch–Carlson: keep α² + β² ≤ 9 on every interval, which keeps each piece monotone.
  for (let i = 0; i < n - 1; i++) {
    if (slope[i] === 0) {
      m[i] = 0;
      m[i + 1] = 0;
      continue;
    }
    const a = m[i] / slope[i];
    const b = m[i + 1] / slope[i];
    const s = a * a + b * b;
    if (s > 9) {
      const t = 3 / Math.sqrt(s);
      m[i] = t * a * slope[i];
      m[i + 1] = t * b * slope[i];
    }
  }
  const segments: CubicSegment[] = [];
  for (let i = 0; i < n - 1; i++) {
    const h = (p[i + 1].x - p[i].x) / 3;
    segments.push({
      c1: { x: p[i].x + h, y: p[i].y + m[i] * h },
      c2: { x: p[i + 1].x - h, y: p[i + 1].y - m[i + 1] * h },
      to: p[i + 1],
    });
  }
  return { start: p[0], segments };
}

/** The SVG path ("M … C …") of a monotone cubic through the points. */
export function smoothPath(points: readonly Xy[]): string {
  const { start, segments } = monotoneCubic(points);
  if (!start) return '';
  const f = (v: number) => Number(v.toFixed(2));
  return [
    `M${f(start.x)},${f(start.y)}`,
    ...segments.map((s) => `C${f(s.c1.x)},${f(s.c1.y)} ${f(s.c2.x)},${f(s.c2.y)} ${f(s.to.x)},${f(s.to.y)}`),
  ].join(' ');
}

'use client';
// The S-curve as the main plot, a thin strip of the iterations' density beneath it on the same
// axis, and what the key beside it does not say drawn in: the target, and the gap between the
// scenarios at the chosen level when there are two.
import type { Histogram, Point } from '@/lib/runs/outcome-data';
import { smoothPath } from '@/lib/brief/chart-geometry';
import { dataAxis, placement, ticksOver } from '@/lib/runs/chart-scale';
import { BottomAxis, INK, LeftAxis, scaleOver, useWidth } from './svg-plot';
import { COLORS } from './setup';

export type Curve = { label: string; points: Point[]; color: string; dash?: string };

const M = { left: 52, right: 14, top: 10 };
const PLOT = 210;
const GAP = 8;
const STRIP = 30;
const AXIS = 40;
export const S_CURVE_HEIGHT = M.top + PLOT + GAP + STRIP + AXIS;

export function SCurveStrip({
  curves,
  strip,
  color,
  target,
  gap,
  formatX,
  xTitle,
}: {
  /** The headline curve first; a second one (the other scenario) is drawn beneath it. */
  curves: Curve[];
  strip: Histogram | null;
  color: string;
  target: { value: number; label: string } | null;
  /** Two values at one level, joined by a labelled bar (the responses' effect). */
  gap: { level: number; from: number; to: number; label: string } | null;
  formatX: (v: number) => string;
  xTitle: string;
}) {
  const [ref, width] = useWidth<HTMLDivElement>();
  const xs = curves.flatMap((c) => c.points.map((p) => p.x));
  if (strip && strip.edges.length) xs.push(strip.edges[0], strip.edges[strip.edges.length - 1]);
  const xTicks = dataAxis(Math.min(...xs), Math.max(...xs), Math.max(4, Math.floor(width / 90)));
  const x = scaleOver(xTicks, M.left, width - M.right);
  const y = scaleOver({ min: 0, max: 1 }, M.top + PLOT, M.top);
  const stripTop = M.top + PLOT + GAP;
  const peak = strip ? Math.max(...strip.counts, 1) : 1;
  const targetAt = target ? placement(target.value, xTicks) : null;
  return (
    <div ref={ref} style={{ height: S_CURVE_HEIGHT }}>
      {width > 0 ? (
        <svg width={width} height={S_CURVE_HEIGHT} role="img" aria-label={`S-curve: ${xTitle}`}>
          <LeftAxis
            ticks={ticksOver(0, 1, 5)}
            y={y}
            at={M.left}
            right={width - M.right}
            format={(v) => `${Math.round(v * 100)}`}
            title="Outcomes at or below (%)"
          />
          {curves
            .slice()
            .reverse()
            .map((c) => (
              <path
                key={c.label}
                d={smoothPath(c.points.map((p) => ({ x: x(p.x), y: y(p.y) })))}
                fill="none"
                stroke={c.color}
                strokeWidth={c === curves[0] ? 2.25 : 1.75}
                strokeDasharray={c.dash}
              >
                <title>{c.label}</title>
              </path>
            ))}
          {gap ? (
            <g>
              <line
                x1={x(gap.from)}
                x2={x(gap.to)}
                y1={y(gap.level)}
                y2={y(gap.level)}
                stroke={COLORS.caution}
                strokeWidth={3}
                strokeLinecap="round"
              />
              <text
                x={Math.max(x(gap.from), x(gap.to)) + 6}
                y={y(gap.level) + 4}
                fontSize={11}
                fontWeight={600}
                fill={COLORS.caution}
              >
                {gap.label}
              </text>
            </g>
          ) : null}
          {target && targetAt === 'inside' ? (
            <g>
              <line
                x1={x(target.value)}
                x2={x(target.value)}
                y1={M.top}
                y2={stripTop + STRIP}
                stroke={COLORS.caution}
                strokeDasharray="2 3"
              />
              {/* Left of the line at the top: an S-curve leaves that corner empty. */}
              <text
                x={x(target.value) - 4}
                y={M.top + 10}
                fontSize={11}
                fill={COLORS.caution}
                textAnchor="end"
              >
                {target.label}
              </text>
            </g>
          ) : null}
          {strip
            ? strip.counts.map((c, k) => (
                <rect
                  key={k}
                  x={x(strip.edges[k])}
                  width={Math.max(0.5, x(strip.edges[k + 1] ?? strip.edges[k]) - x(strip.edges[k]) - 0.5)}
                  y={stripTop + STRIP * (1 - c / peak)}
                  height={STRIP * (c / peak)}
                  fill={color}
                  opacity={0.55}
                />
              ))
            : null}
          <text x={M.left - 6} y={stripTop + STRIP / 2 + 4} fontSize={10} textAnchor="end" fill={INK.faint}>
            density
          </text>
          <BottomAxis
            ticks={xTicks}
            x={x}
            at={stripTop + STRIP}
            left={M.left}
            right={width - M.right}
            format={formatX}
            title={xTitle}
          />
        </svg>
      ) : null}
    </div>
  );
}

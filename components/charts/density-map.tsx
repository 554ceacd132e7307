'use client';
// Cost against finish as a density map: the sampled iterations binned into hexagons, darker where
// more fall, the targets as two lines and the share of outcomes printed in each quadrant around
// them; with a joint-confidence frontier drawn over it when the result holds one.
import type { Point } from '@/lib/runs/outcome-data';
import { hexagonPath, hexBins, type Quadrants } from '@/lib/runs/density';
import { dataAxis, placement } from '@/lib/runs/chart-scale';
import { BottomAxis, INK, LeftAxis, scaleOver, useWidth } from './svg-plot';
import { COLORS } from './setup';

const M = { left: 64, right: 14, top: 10, bottom: 40 };
const RADIUS = 7;

export function DensityMap({
  points,
  targets,
  quadrants,
  frontier,
  formatX,
  formatY,
  formatShare,
  yTitle,
  height,
}: {
  /** (duration, cost) per sampled iteration. */
  points: Point[];
  targets: { duration: number | null; cost: number | null };
  quadrants: Quadrants | null;
  frontier: { label: string; points: Point[] } | null;
  formatX: (v: number) => string;
  formatY: (v: number) => string;
  formatShare: (v: number) => string;
  /** The cost axis's title, with its currency. */
  yTitle: string;
  height: number;
}) {
  const [ref, width] = useWidth<HTMLDivElement>();
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const xTicks = dataAxis(Math.min(...xs), Math.max(...xs), Math.max(4, Math.floor(width / 100)));
  const yTicks = dataAxis(Math.min(...ys), Math.max(...ys), 6);
  const bottom = height - M.bottom;
  const x = scaleOver(xTicks, M.left, width - M.right);
  const y = scaleOver(yTicks, bottom, M.top);
  const cells =
    width > 0
      ? hexBins(
          points.map((p) => ({ x: x(p.x), y: y(p.y) })),
          RADIUS,
        )
      : [];
  const peak = Math.max(1, ...cells.map((c) => c.count));
  const tx =
    targets.duration !== null && placement(targets.duration, xTicks) === 'inside'
      ? x(targets.duration)
      : null;
  const ty = targets.cost !== null && placement(targets.cost, yTicks) === 'inside' ? y(targets.cost) : null;
  const inPlot = (p: Point) =>
    p.x >= xTicks.min && p.x <= xTicks.max && p.y >= yTicks.min && p.y <= yTicks.max;
  // The frontier's label sits at its last point inside the plot.
  const frontierEnd = frontier?.points.filter(inPlot).at(-1) ?? null;
  const corner = (share: number, label: string, right: boolean, top: boolean) => (
    <text
      x={right ? width - M.right - 6 : M.left + 6}
      y={top ? M.top + 14 : bottom - 8}
      textAnchor={right ? 'end' : 'start'}
      fontSize={11}
      fill={INK.text}
      paintOrder="stroke"
      stroke="#fffdf8"
      strokeWidth={3}
    >
      <tspan fontWeight={700} fill={COLORS.ink}>
        {formatShare(share)}
      </tspan>{' '}
      {label}
    </text>
  );
  return (
    <div ref={ref} style={{ height }}>
      {width > 0 ? (
        <svg width={width} height={height} role="img" aria-label="Density of cost against finish">
          <LeftAxis
            ticks={yTicks}
            y={y}
            at={M.left}
            right={width - M.right}
            format={formatY}
            title={yTitle}
          />
          <clipPath id="density-plot">
            <rect x={M.left} y={M.top} width={width - M.left - M.right} height={bottom - M.top} />
          </clipPath>
          <g clipPath="url(#density-plot)">
            {cells.map((c) => (
              <path
                key={`${c.x},${c.y}`}
                d={hexagonPath(c.x, c.y, RADIUS)}
                fill={COLORS.cost}
                // A floor keeps single iterations visible; the rest scales with the square root,
                // so that the sparse tails and the dense middle both read.
                fillOpacity={0.12 + 0.88 * Math.sqrt(c.count / peak)}
              >
                <title>{`${c.count} iteration${c.count === 1 ? '' : 's'}`}</title>
              </path>
            ))}
            {frontier ? (
              <polyline
                points={frontier.points.map((p) => `${x(p.x)},${y(p.y)}`).join(' ')}
                fill="none"
                stroke={COLORS.ink}
                strokeWidth={2}
                strokeDasharray="6 3"
              >
                <title>{frontier.label}</title>
              </polyline>
            ) : null}
          </g>
          {frontierEnd ? (
            <text
              x={x(frontierEnd.x)}
              y={y(frontierEnd.y) - 6}
              textAnchor="end"
              fontSize={11}
              fontWeight={600}
              fill={COLORS.ink}
              paintOrder="stroke"
              stroke="#fffdf8"
              strokeWidth={3}
            >
              {frontier!.label}
            </text>
          ) : null}
          {tx !== null && ty !== null ? (
            <circle cx={tx} cy={ty} r={4} fill={COLORS.caution}>
              <title>{`Targets: finish by ${formatX(targets.duration!)}, cost at most ${formatY(targets.cost!)}`}</title>
            </circle>
          ) : null}
          {tx !== null ? (
            <line x1={tx} x2={tx} y1={M.top} y2={bottom} stroke={COLORS.caution} strokeWidth={1.5} />
          ) : null}
          {ty !== null ? (
            <line
              x1={M.left}
              x2={width - M.right}
              y1={ty}
              y2={ty}
              stroke={COLORS.caution}
              strokeWidth={1.5}
            />
          ) : null}
          {quadrants && tx !== null && ty !== null ? (
            <g data-testid="density-quadrants">
              {corner(quadrants.both, 'within both', false, false)}
              {corner(quadrants.lateOnly, 'within cost, late', true, false)}
              {corner(quadrants.overOnly, 'on time, over cost', false, true)}
              {corner(quadrants.neither, 'over cost and late', true, true)}
            </g>
          ) : null}
          <BottomAxis
            ticks={xTicks}
            x={x}
            at={bottom}
            left={M.left}
            right={width - M.right}
            format={formatX}
            title="Finish date"
          />
        </svg>
      ) : null}
    </div>
  );
}

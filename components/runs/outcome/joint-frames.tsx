'use client';
// Cost and finish together: the density map of the sampled iterations with the targets, the
// quadrant shares and the joint-confidence frontier; and the joint confidence at the P-levels.
import { ChartFrame } from '@/components/charts/chart-frame';
import { DensityMap } from '@/components/charts/density-map';
import type { JointResult, SimulationResult } from '@/lib/sim';
import { quadrantShares, quadrantsFromProbabilities, type Quadrants } from '@/lib/runs/density';
import { placement } from '@/lib/runs/chart-scale';
import type { Point } from '@/lib/runs/outcome-data';

const DENSITY_HEIGHT = 330;

/** The four shares: over all iterations when the result holds the three probabilities, else the sample's. */
function quadrantsOf(
  result: SimulationResult,
  points: Point[],
  targets: { duration: number | null; cost: number | null },
): { shares: Quadrants; from: 'all' | 'sample' } | null {
  if (targets.duration === null || targets.cost === null) return null;
  const c = result.cost.probabilityWithinTarget?.value;
  const d = result.duration?.probabilityWithinTarget?.value;
  const j = result.joint?.probability;
  if (c !== undefined && d !== undefined && j !== undefined)
    return { shares: quadrantsFromProbabilities(c, d, j), from: 'all' };
  return points.length
    ? { shares: quadrantShares(points, targets.duration, targets.cost), from: 'sample' }
    : null;
}

export function DensityFrame({
  result,
  points,
  iterations,
  targets,
  formatX,
  formatY,
  formatShare,
  formatCount,
  currency,
}: {
  result: SimulationResult;
  points: Point[];
  iterations: number;
  targets: { duration: number | null; cost: number | null };
  formatX: (v: number) => string;
  formatY: (v: number) => string;
  formatShare: (v: number) => string;
  formatCount: (n: number) => string;
  currency: string;
}) {
  const q = quadrantsOf(result, points, targets);
  const frontier = result.joint?.frontier;
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const range = (v: number[]) => ({ min: Math.min(...v), max: Math.max(...v) });
  const off: string[] = [];
  if (targets.duration !== null && placement(targets.duration, range(xs)) !== 'inside')
    off.push(
      `The finish target ${formatX(targets.duration)} lies ${placement(targets.duration, range(xs)) === 'above' ? 'after' : 'before'} every sampled finish, off the chart.`,
    );
  if (targets.cost !== null && placement(targets.cost, range(ys)) !== 'inside')
    off.push(
      `The cost target ${formatY(targets.cost)} lies ${placement(targets.cost, range(ys)) === 'above' ? 'above' : 'below'} every sampled cost, off the chart.`,
    );
  const shares = q
    ? `Within both ${formatShare(q.shares.both)}; within cost but late ${formatShare(q.shares.lateOnly)}; on time but over cost ${formatShare(q.shares.overOnly)}; over cost and late ${formatShare(q.shares.neither)}.`
    : null;
  return (
    <ChartFrame
      title="Cost against finish: where the outcomes fall"
      testId="chart-scatter"
      reading={
        q
          ? `${formatShare(q.shares.both)} of simulated outcomes meet both the cost and the finish target (lower left of the amber lines).`
          : 'Set both a cost and a finish target to read the share of outcomes around them.'
      }
      note={
        <>
          Each hexagon holds the iterations that fall in it, darker where more do:{' '}
          {formatCount(points.length)} of the {formatCount(iterations)} iterations.{' '}
          {q ? (q.from === 'all' ? 'Shares: all iterations. ' : 'Shares: these sampled iterations. ') : ''}
          {frontier
            ? `Dashed line: the pairs of cost and finish met together with ${Math.round(frontier.level * 100)} % confidence. `
            : ''}
          {off.length ? (
            <span className="block text-caution-dark">
              {off.join(' ')} {shares}
            </span>
          ) : null}
        </>
      }
      height={DENSITY_HEIGHT}
    >
      <DensityMap
        points={points}
        targets={targets}
        quadrants={q?.shares ?? null}
        frontier={
          frontier
            ? {
                label: `${Math.round(frontier.level * 100)} % joint confidence`,
                points: frontier.points.map((p) => ({ x: p.duration, y: p.cost })),
              }
            : null
        }
        formatX={formatX}
        formatY={formatY}
        formatShare={formatShare}
        yTitle={`Total cost (${currency})`}
        height={DENSITY_HEIGHT}
      />
    </ChartFrame>
  );
}

/** Joint confidence at the P-levels, and the frontier's pairs as a table. */
export function JointTables({
  joint,
  formatShare,
  formatDate,
  money,
}: {
  joint: JointResult | undefined;
  formatShare: (v: number) => string;
  formatDate: (days: number) => string;
  money: (v: number) => string;
}) {
  if (!joint?.atPLevels) {
    return (
      <p className="text-sm text-ink-soft" data-testid="joint-levels">
        {joint
          ? 'This run was made before results held joint confidence by level; run it again to see it.'
          : 'Joint confidence needs a cost target and a finish target on the run, and a schedule.'}
      </p>
    );
  }
  const levels = Object.entries(joint.atPLevels) as [string, number][];
  const frontier = joint.frontier;
  return (
    <div className="space-y-3">
      <table className="w-full border-collapse text-sm" data-testid="joint-levels">
        <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
          Joint confidence by level
        </caption>
        <thead className="text-xs text-ink-soft">
          <tr className="border-b border-rule">
            <th className="py-1 pr-2 text-left font-medium">Cost and finish both within their</th>
            <th className="py-1 text-right font-medium">Share of outcomes</th>
          </tr>
        </thead>
        <tbody>
          {levels.map(([k, v]) => (
            <tr key={k} className="border-b border-rule/60">
              <td className="py-0.5 pr-2">{k}</td>
              <td className="num py-0.5">{formatShare(v)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-soft">
        Funding both totals at their P80 is met together less often than 80 %: the table says how often.
      </p>
      {frontier ? (
        <table className="w-full border-collapse text-sm" data-testid="joint-frontier">
          <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
            Pairs met together at {Math.round(frontier.level * 100)} % confidence
          </caption>
          <thead className="text-xs text-ink-soft">
            <tr className="border-b border-rule">
              <th className="py-1 pr-2 text-left font-medium">Finish by</th>
              <th className="py-1 text-right font-medium">Cost at most</th>
            </tr>
          </thead>
          <tbody>
            {frontier.points
              .filter((_, i, all) => i % Math.ceil(all.length / 6) === 0 || i === all.length - 1)
              .map((p) => (
                <tr key={p.duration} className="border-b border-rule/60">
                  <td className="num py-0.5 pr-2 text-left">{formatDate(p.duration)}</td>
                  <td className="num py-0.5">{money(p.cost)}</td>
                </tr>
              ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}

'use client';
// The schedule network drawn for checking its logic at a glance: activities as boxes (code, base
// duration, name; a branch dashed with its probability), links as arrows labelled with their type
// and lag when not a plain finish-to-start, and the most critical path of the latest run (or,
// before any run, the base schedule's critical path) in the time colour.
import { useMemo } from 'react';
import type { ModelActivity } from '@/lib/sim';
import { BOX, layoutNetwork } from './network-layout';

const percent = (x: number) => `${Math.round(x * 100)}%`;
const clip = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1)}…` : text);

export function NetworkDiagram({
  activities,
  criticality,
  runLabel,
}: {
  activities: ModelActivity[];
  /** Criticality per activity in the latest successful run; null before any run. */
  criticality: Record<string, number> | null;
  /** Which run the highlight comes from, e.g. "run 12". */
  runLabel: string | null;
}) {
  const layout = useMemo(() => layoutNetwork(activities, criticality), [activities, criticality]);
  const title = 'Network diagram';
  if (!layout.ok) {
    return (
      <section aria-label={title} className="rounded border border-rule bg-paper-raised px-3 py-2 text-sm">
        <h2 className="font-semibold">{title}</h2>
        <p className="text-ink-soft">{layout.reason}</p>
      </section>
    );
  }
  return (
    <section aria-label={title} className="rounded border border-rule bg-paper-raised px-3 py-2 text-sm">
      <h2 className="font-semibold">{title}</h2>
      <p className="text-xs text-ink-soft">
        {criticality
          ? `Highlighted: the path most often critical in ${runLabel ?? 'the latest run'} (percentages: share of iterations on the critical path).`
          : 'Highlighted: the critical path of the base schedule (no run yet). Durations are base working days.'}{' '}
        Dashed boxes are branches that happen only with the probability shown.
      </p>
      <div className="mt-2 overflow-x-auto">
        <svg
          width={layout.width}
          height={layout.height}
          viewBox={`0 0 ${layout.width} ${layout.height}`}
          role="img"
          aria-label={`${layout.boxes.length} activities and ${layout.links.length} links`}
          className="font-sans"
        >
          <defs>
            {(['plain', 'path'] as const).map((kind) => (
              <marker
                key={kind}
                id={`arrow-${kind}`}
                viewBox="0 0 8 8"
                refX="7"
                refY="4"
                markerWidth="7"
                markerHeight="7"
                orient="auto"
              >
                <path d="M0,0 L8,4 L0,8 z" className={kind === 'path' ? 'fill-time' : 'fill-ink-faint'} />
              </marker>
            ))}
          </defs>
          {layout.links.map((l, i) => (
            <g key={`${l.from}-${l.to}-${i}`}>
              <path
                d={l.path}
                fill="none"
                className={l.highlighted ? 'stroke-time' : 'stroke-ink-faint'}
                strokeWidth={l.highlighted ? 2 : 1}
                markerEnd={`url(#arrow-${l.highlighted ? 'path' : 'plain'})`}
              >
                <title>{`${l.from} → ${l.to}${l.label ? ` (${l.label})` : ''}`}</title>
              </path>
              {l.label ? (
                <text x={l.labelX} y={l.labelY} textAnchor="middle" className="fill-ink-soft text-2xs">
                  {l.label}
                </text>
              ) : null}
            </g>
          ))}
          {layout.boxes.map((b) => (
            <g key={b.id} transform={`translate(${b.x} ${b.y})`}>
              <title>{`${b.id} ${b.name}: ${b.days} working days${b.existence < 1 ? `, happens with ${percent(b.existence)}` : ''}${b.criticality !== null ? `, critical in ${percent(b.criticality)} of iterations` : ''}`}</title>
              <rect
                width={BOX.width}
                height={BOX.height}
                rx={3}
                className={b.highlighted ? 'fill-time-light stroke-time' : 'fill-paper stroke-rule-strong'}
                strokeWidth={b.highlighted ? 2 : 1}
                strokeDasharray={b.existence < 1 ? '5 3' : undefined}
              />
              <text x={8} y={17} className="fill-ink text-xs font-semibold">
                {b.id}
              </text>
              <text x={BOX.width - 8} y={17} textAnchor="end" className="fill-ink-soft text-xs tabular-nums">
                {`${+b.days.toFixed(1)} d${b.existence < 1 ? ` · ${percent(b.existence)}` : ''}`}
              </text>
              <text x={8} y={35} className="fill-ink-soft text-2xs">
                {clip(b.name, 24)}
              </text>
              {b.criticality !== null ? (
                <text
                  x={BOX.width - 8}
                  y={45}
                  textAnchor="end"
                  className="fill-time-dark text-2xs tabular-nums"
                >
                  {percent(b.criticality)}
                </text>
              ) : null}
            </g>
          ))}
        </svg>
      </div>
    </section>
  );
}

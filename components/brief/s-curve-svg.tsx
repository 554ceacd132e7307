import { sCurveGeometry, smoothPath } from '@/lib/brief/chart-geometry';
import { SvgFigure } from './svg-figure';

const W = 920;
const H = 230;

export type CurveMarker = { label: string; value: number; tone: 'base' | 'level' | 'target' };

const TONE = { base: '#7b8190', level: '#16607a', target: '#b7791f' };

/**
 * An S-curve as SVG: crisp on paper, no script needed to print it. The curve is drawn smooth
 * (monotone cubic through the result's percentiles), so it never dips between them. The axis
 * stretches to every marker, so none is dropped.
 */
export function SCurveSvg({
  curve,
  markers,
  tickText,
  label,
  caption,
  colour = TONE.level,
  testId,
}: {
  curve: { x: number; y: number }[];
  markers: CurveMarker[];
  tickText: (value: number) => string;
  label: string;
  caption: React.ReactNode;
  colour?: string;
  testId?: string;
}) {
  const g = sCurveGeometry(curve, { x: 0, y: 0, width: W, height: H }, markers, {
    left: 44,
    bottom: 24,
    top: 14,
    right: 14,
  });
  const { plot } = g;
  const toneOf = new Map(markers.map((m) => [m.label, m.tone]));
  return (
    <div data-testid={testId}>
      <SvgFigure width={W} height={H} label={label} caption={caption}>
        {g.yTicks.map((t) => (
          <g key={t.value}>
            <line x1={plot.x} x2={plot.x + plot.width} y1={t.at} y2={t.at} stroke="#e6e1d6" />
            <text x={plot.x - 6} y={t.at + 3} textAnchor="end" fontSize="10" fill="#7b8190">
              {`${Math.round(t.value * 100)} %`}
            </text>
          </g>
        ))}
        {g.xTicks.map((t, i) => (
          <text
            key={t.value}
            x={t.at}
            y={plot.y + plot.height + 15}
            // The last label ends at the axis's end, so a long one (a date) is not cut at the edge.
            textAnchor={i === g.xTicks.length - 1 ? 'end' : 'middle'}
            fontSize="10"
            fill="#7b8190"
          >
            {tickText(t.value)}
          </text>
        ))}
        <path
          d={`M${plot.x},${plot.y} V${plot.y + plot.height} H${plot.x + plot.width}`}
          fill="none"
          stroke="#4a5261"
        />
        {g.markers.map((m) => {
          const c = TONE[toneOf.get(m.label) ?? 'level'];
          return (
            <g key={m.label}>
              <line
                x1={m.at}
                x2={m.at}
                y1={plot.y}
                y2={plot.y + plot.height}
                stroke={c}
                strokeDasharray="3 3"
              />
              <text x={m.at + 3} y={plot.y - 3 + m.row * 11} fontSize="10" fill={c}>
                {m.label}
              </text>
            </g>
          );
        })}
        <path d={smoothPath(g.line)} fill="none" stroke={colour} strokeWidth="2" strokeLinejoin="round" />
      </SvgFigure>
    </div>
  );
}

import { formatMoney, formatMoneyShort } from '@/lib/runs/format';
import { sCurveGeometry } from '@/lib/brief/chart-geometry';
import type { BriefData } from '@/lib/brief/build';
import { SvgFigure } from './svg-figure';

const W = 920;
const H = 230;

/** The cost S-curve as SVG: crisp on paper, no script needed to print it. */
export function SCurveSvg({ brief }: { brief: BriefData }) {
  const currency = brief.project.currency;
  const markers = [
    { label: 'Base', value: brief.cost.base },
    { label: brief.contingency.level, value: brief.contingency.value },
  ];
  if (brief.cost.target) markers.push({ label: 'Target', value: brief.cost.target.value });
  const g = sCurveGeometry(brief.cost.curve, { x: 0, y: 0, width: W, height: H }, markers, {
    left: 44,
    bottom: 24,
    top: 14,
    right: 14,
  });
  const { plot } = g;
  const colour = (label: string) =>
    label === 'Base' ? '#7b8190' : label === 'Target' ? '#b7791f' : '#16607a';
  return (
    <SvgFigure
      width={W}
      height={H}
      label={`S-curve of total cost: ${brief.contingency.level} is ${formatMoney(brief.contingency.value, currency)}`}
      caption={
        <>
          Share of simulated outcomes (vertical) at or below each total cost in {currency} (horizontal).{' '}
          {brief.contingency.level.slice(1)} % of outcomes cost at most{' '}
          {formatMoney(brief.contingency.value, currency)}.
        </>
      }
    >
      {g.yTicks.map((t) => (
        <g key={t.value}>
          <line x1={plot.x} x2={plot.x + plot.width} y1={t.at} y2={t.at} stroke="#e6e1d6" />
          <text x={plot.x - 6} y={t.at + 3} textAnchor="end" fontSize="10" fill="#7b8190">
            {Math.round(t.value * 100)} %
          </text>
        </g>
      ))}
      {g.xTicks.map((t) => (
        <text
          key={t.value}
          x={t.at}
          y={plot.y + plot.height + 15}
          textAnchor="middle"
          fontSize="10"
          fill="#7b8190"
        >
          {formatMoneyShort(t.value, currency)}
        </text>
      ))}
      <path
        d={`M${plot.x},${plot.y} V${plot.y + plot.height} H${plot.x + plot.width}`}
        fill="none"
        stroke="#4a5261"
      />
      {g.markers.map((m) => (
        <g key={m.label}>
          <line
            x1={m.at}
            x2={m.at}
            y1={plot.y}
            y2={plot.y + plot.height}
            stroke={colour(m.label)}
            strokeDasharray="3 3"
          />
          <text x={m.at + 3} y={plot.y - 3} fontSize="10" fill={colour(m.label)}>
            {m.label}
          </text>
        </g>
      ))}
      <polyline
        points={g.line.map((p) => `${p.x},${p.y}`).join(' ')}
        fill="none"
        stroke="#16607a"
        strokeWidth="2"
        strokeLinejoin="round"
      />
    </SvgFigure>
  );
}

import { tornadoGeometry } from '@/lib/brief/chart-geometry';
import type { DriverBrief } from '@/lib/brief/build';
import { SvgFigure } from './svg-figure';

const W = 920;
const CAPTION =
  'Rank correlation of each input with total cost: the longer the bar, the more that input drives the spread and the more its mitigation is worth.';

/** The top drivers of cost as SVG bars of their rank correlation with the total. */
export function TornadoSvg({ drivers }: { drivers: DriverBrief[] }) {
  if (!drivers.length)
    return <p className="text-sm text-ink-faint">No input varies: there is nothing to rank.</p>;
  const height = drivers.length * 22 + 24;
  const g = tornadoGeometry(
    drivers.map((d) => ({ label: d.name, value: d.rankCorrelation })),
    { x: 0, y: 0, width: W, height },
    200,
  );
  return (
    <SvgFigure width={W} height={height} label="Top drivers of total cost" caption={CAPTION}>
      {g.ticks.map((t) => (
        <g key={t.value}>
          <line x1={t.at} x2={t.at} y1={g.plot.y} y2={g.plot.y + g.plot.height} stroke="#e6e1d6" />
          <text x={t.at} y={g.plot.y + g.plot.height + 14} textAnchor="middle" fontSize="10" fill="#7b8190">
            {t.value.toFixed(2)}
          </text>
        </g>
      ))}
      {g.bars.map((b) => (
        <g key={b.label}>
          <text x={192} y={b.y + b.height / 2 + 4} textAnchor="end" fontSize="11" fill="#1d2430">
            {b.label.length > 32 ? `${b.label.slice(0, 31)}…` : b.label}
          </text>
          <rect
            x={b.x}
            y={b.y}
            width={Math.max(1, b.width)}
            height={b.height}
            fill={b.value < 0 ? '#7a3f86' : '#16607a'}
          >
            <title>
              {b.label}: {b.value.toFixed(3)}
            </title>
          </rect>
        </g>
      ))}
      <line x1={g.zero} x2={g.zero} y1={g.plot.y} y2={g.plot.y + g.plot.height} stroke="#4a5261" />
    </SvgFigure>
  );
}

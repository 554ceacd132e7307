import { tornadoGeometry } from '@/lib/brief/chart-geometry';
import type { DriverBrief } from '@/lib/brief/build';
import { KIND_LABEL } from '@/lib/brief/wording';
import { SvgFigure } from './svg-figure';

const W = 920;
const KIND_X = 4;
const NAME_X = 276;
const SWING_W = 170;

/**
 * The top drivers of a total as SVG bars of their rank correlation with it, each named by its
 * kind, code and name, with the mean total at its low and high tenth on the right when known.
 */
export function TornadoSvg({
  drivers,
  label,
  caption,
  swingText,
  testId,
}: {
  drivers: DriverBrief[];
  label: string;
  caption: string;
  swingText: (v: number) => string;
  testId?: string;
}) {
  if (!drivers.length)
    return <p className="text-sm text-ink-faint">No input varies: there is nothing to rank.</p>;
  const height = drivers.length * 22 + 24;
  const g = tornadoGeometry(
    drivers.map((d) => ({ label: d.id, value: d.rankCorrelation })),
    { x: 0, y: 0, width: W - SWING_W, height },
    NAME_X + 8,
  );
  return (
    <div data-testid={testId}>
      <SvgFigure width={W} height={height} label={label} caption={caption}>
        {g.ticks.map((t) => (
          <g key={t.value}>
            <line x1={t.at} x2={t.at} y1={g.plot.y} y2={g.plot.y + g.plot.height} stroke="#e6e1d6" />
            <text x={t.at} y={g.plot.y + g.plot.height + 14} textAnchor="middle" fontSize="10" fill="#7b8190">
              {t.value.toFixed(2)}
            </text>
          </g>
        ))}
        <text x={W} y={g.plot.y + g.plot.height + 14} textAnchor="end" fontSize="10" fill="#7b8190">
          mean total, low – high tenth
        </text>
        {g.bars.map((b, i) => {
          const d = drivers[i];
          const mid = b.y + b.height / 2 + 4;
          return (
            <g key={d.id}>
              <text x={KIND_X} y={mid} fontSize="10" fill="#7b8190">
                {d.kind ? KIND_LABEL[d.kind] : ''}
              </text>
              <text x={NAME_X} y={mid} textAnchor="end" fontSize="11" fill="#1d2430">
                {d.name.length > 30 ? `${d.name.slice(0, 29)}…` : d.name}
              </text>
              <rect
                x={b.x}
                y={b.y}
                width={Math.max(1, b.width)}
                height={b.height}
                fill={b.value < 0 ? '#7a3f86' : '#16607a'}
              >
                <title>{`${d.name}: rank correlation ${b.value.toFixed(3)}`}</title>
              </rect>
              {d.swing ? (
                <text x={W} y={mid} textAnchor="end" fontSize="10" fill="#4a5261">
                  {`${swingText(d.swing[0])} – ${swingText(d.swing[1])}`}
                </text>
              ) : null}
            </g>
          );
        })}
        <line x1={g.zero} x2={g.zero} y1={g.plot.y} y2={g.plot.y + g.plot.height} stroke="#4a5261" />
      </SvgFigure>
    </div>
  );
}

'use client';
// The correlation coefficients as a matrix heatmap: blue for inputs that move together, plum
// for inputs that move against each other, paler as the coefficient nears 0.
import { Chart as ChartJS, LinearScale, CategoryScale, Tooltip, type ChartOptions } from 'chart.js';
import { MatrixController, MatrixElement } from 'chartjs-chart-matrix';
import { Chart } from 'react-chartjs-2';

ChartJS.register(MatrixController, MatrixElement, LinearScale, CategoryScale, Tooltip);

type Cell = { x: string; y: string; v: number };

export function correlationColour(v: number): string {
  const a = Math.min(1, Math.abs(v));
  const [r, g, b] = v >= 0 ? [22, 96, 122] : [122, 63, 134];
  return `rgba(${r}, ${g}, ${b}, ${0.12 + 0.88 * a})`;
}

export function CorrelationHeatmap({
  codes,
  pairs,
}: {
  codes: string[];
  pairs: { a: string; b: string; rho: number }[];
}) {
  if (codes.length < 2) {
    return <p className="text-sm text-ink-soft">The heatmap appears once two inputs are correlated.</p>;
  }
  const value = new Map<string, number>();
  for (const p of pairs) {
    value.set(`${p.a}\u0000${p.b}`, p.rho);
    value.set(`${p.b}\u0000${p.a}`, p.rho);
  }
  const data: Cell[] = [];
  for (const x of codes)
    for (const y of codes) data.push({ x, y, v: x === y ? 1 : (value.get(`${x}\u0000${y}`) ?? 0) });
  const n = codes.length;
  const options: ChartOptions<'matrix'> = {
    maintainAspectRatio: false,
    animation: false,
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          title: () => '',
          label: (ctx) => {
            const c = ctx.raw as Cell;
            return `${c.x} – ${c.y}: ${c.v.toFixed(2)}`;
          },
        },
      },
    },
    scales: {
      x: {
        type: 'category',
        labels: codes,
        offset: true,
        ticks: { autoSkip: false, font: { size: 10 } },
        grid: { display: false },
      },
      y: {
        type: 'category',
        labels: codes,
        offset: true,
        reverse: true,
        ticks: { autoSkip: false, font: { size: 10 } },
        grid: { display: false },
      },
    },
  };
  return (
    <figure aria-label="Correlation matrix heatmap" className="space-y-1">
      <figcaption className="text-sm font-semibold">Correlation matrix (rank correlation)</figcaption>
      <div style={{ height: Math.min(520, 60 + n * 22), width: Math.min(520, 80 + n * 22) }}>
        <Chart
          type="matrix"
          data={{
            datasets: [
              {
                label: 'ρ',
                data,
                backgroundColor: (ctx) => correlationColour((ctx.raw as Cell | undefined)?.v ?? 0),
                borderColor: '#fffdf8',
                borderWidth: 1,
                width: ({ chart }) => (chart.chartArea || { width: 0 }).width / n - 1,
                height: ({ chart }) => (chart.chartArea || { height: 0 }).height / n - 1,
              },
            ],
          }}
          options={options}
        />
      </div>
      <p className="text-2xs text-ink-faint">
        Blue: move together; plum: move against each other; pale: close to 0. The diagonal is 1.
      </p>
    </figure>
  );
}

// A 5×5 probability–impact matrix: how many open risks fall in each band of probability and of
// expected cost impact (mean impact as a share of the base estimate).
import type { GridRow } from '@/components/grid/use-register-rows';

const P_BANDS = [0.1, 0.3, 0.5, 0.7, 1.0001];
const P_LABELS = ['≤10%', '10–30%', '30–50%', '50–70%', '>70%'];
const I_BANDS = [0.002, 0.005, 0.01, 0.03, Infinity];
const I_LABELS = ['<0.2%', '0.2–0.5%', '0.5–1%', '1–3%', '>3%'];

// Cell colour by score (probability band + impact band): calm teal through sand to rust.
const SCORE_COLOURS = [
  '#dbe9e4',
  '#dbe9e4',
  '#e7ecd4',
  '#f1e7c6',
  '#f3d9b1',
  '#eec39a',
  '#e3a98a',
  '#d68f7d',
  '#c9776f',
];

const band = (x: number, edges: number[]) => edges.findIndex((e) => x <= e);

export function ProbabilityImpactMatrix({
  risks,
  baseEstimate,
  meanCost,
}: {
  risks: GridRow[];
  baseEstimate: number;
  meanCost: (r: GridRow) => number | null;
}) {
  const counts = Array.from({ length: 5 }, () => new Array<number>(5).fill(0));
  let placed = 0;
  for (const r of risks) {
    if (r.status === 'closed' || typeof r.probability !== 'number') continue;
    const cost = meanCost(r);
    if (cost === null || baseEstimate <= 0) continue;
    const p = band(r.probability, P_BANDS);
    const i = band(cost / baseEstimate, I_BANDS);
    if (p < 0 || i < 0) continue;
    counts[p][i]++;
    placed++;
  }
  return (
    <figure className="flex flex-wrap items-end gap-x-6 gap-y-2" aria-label="Probability–impact matrix">
      <table className="border-collapse text-xs">
        <tbody>
          {[4, 3, 2, 1, 0].map((p) => (
            <tr key={p}>
              <th scope="row" className="pr-2 text-right font-normal text-ink-soft">
                {P_LABELS[p]}
              </th>
              {[0, 1, 2, 3, 4].map((i) => (
                <td
                  key={i}
                  className="num h-7 w-12 border border-paper-raised text-center text-sm"
                  style={{ background: SCORE_COLOURS[p + i], textAlign: 'center' }}
                  data-testid={`pim-${p}-${i}`}
                  title={`${counts[p][i]} risk(s): probability ${P_LABELS[p]}, mean cost ${I_LABELS[i]} of base`}
                >
                  {counts[p][i] || ''}
                </td>
              ))}
            </tr>
          ))}
          <tr>
            <td />
            {I_LABELS.map((l) => (
              <td key={l} className="pt-1 text-center text-2xs text-ink-soft">
                {l}
              </td>
            ))}
          </tr>
        </tbody>
      </table>
      <figcaption className="max-w-xs text-xs text-ink-soft">
        Rows: probability. Columns: mean cost impact as a share of the base estimate. {placed} open risk
        {placed === 1 ? '' : 's'} with a cost impact.
      </figcaption>
    </figure>
  );
}

import type { MitigationResult, PercentileKey } from '@/lib/sim';
import { formatChange } from '@/lib/runs/format';

const LEVELS: PercentileKey[] = ['P50', 'P80', 'P90'];

/**
 * Before and after the responses, side by side: mean and P-levels of cost (and duration), and what
 * the responses change. The post figures include the responses' own cost; both come from the same
 * iterations, so the change is the responses' effect and not sampling noise.
 */
export function MitigationTable({
  mitigation,
  level,
  money,
  days,
}: {
  mitigation: MitigationResult;
  level: PercentileKey;
  money: (v: number) => string;
  days: (v: number) => string;
}) {
  const levels = LEVELS.includes(level) ? LEVELS : [...LEVELS, level].sort();
  const sides = [
    { title: 'Cost', pre: mitigation.pre.cost, post: mitigation.post.cost, f: money },
    ...(mitigation.pre.duration && mitigation.post.duration
      ? [{ title: 'Duration', pre: mitigation.pre.duration, post: mitigation.post.duration, f: days }]
      : []),
  ];
  return (
    <table className="w-full border-collapse text-sm" data-testid="mitigation-compare">
      <thead className="text-xs text-ink-soft">
        <tr className="border-b border-rule">
          <th className="py-1 pr-3 text-left font-medium" />
          <th className="py-1 pl-3 text-right font-medium">Before the responses</th>
          <th className="py-1 pl-3 text-right font-medium">After (with their cost)</th>
          <th className="py-1 pl-3 text-right font-medium">Change</th>
        </tr>
      </thead>
      {sides.map((s) => (
        <tbody key={s.title}>
          <tr>
            <th
              colSpan={4}
              className="pt-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft"
            >
              {s.title}
            </th>
          </tr>
          {[
            { label: 'Mean', pre: s.pre.mean, post: s.post.mean },
            ...levels.map((k) => ({ label: k, pre: s.pre.percentiles[k], post: s.post.percentiles[k] })),
          ].map((r) => (
            <tr
              key={r.label}
              className={`border-b border-rule/60 ${r.label === level ? 'font-semibold' : ''}`}
              data-testid={`mitigation-${s.title.toLowerCase()}-${r.label}`}
            >
              <td className="py-0.5 pr-3">{r.label}</td>
              <td className="num py-0.5 pl-3">{s.f(r.pre)}</td>
              <td className="num py-0.5 pl-3">{s.f(r.post)}</td>
              <td className="num py-0.5 pl-3">{formatChange(r.post - r.pre, s.f)}</td>
            </tr>
          ))}
        </tbody>
      ))}
    </table>
  );
}

import { formatDays, formatMoney } from '@/lib/runs/format';
import { percentileOf, type BriefData, type TotalBrief } from '@/lib/brief/build';
import { dateText, probabilityText, signedPercent } from '@/lib/brief/format';

/** Base, the funded level and its contingency, in three boxes the eye finds first. */
export function HeadlineFigures({ brief }: { brief: BriefData }) {
  const c = brief.project.currency;
  const level = brief.contingency.level;
  const atLevel = brief.cost.percentiles.find((p) => p.level === level);
  const boxes = [
    {
      label: 'Base estimate',
      value: formatMoney(brief.cost.base, c),
      note: 'deterministic sum of the inputs',
      accent: false,
    },
    {
      label: `Cost ${level}`,
      value: formatMoney(brief.contingency.value, c),
      note: atLevel
        ? `95 % interval ${formatMoney(atLevel.ci95[0], c)} – ${formatMoney(atLevel.ci95[1], c)}`
        : '',
      accent: true,
    },
    {
      label: `Contingency at ${level}`,
      value: formatMoney(brief.contingency.amount, c),
      note:
        brief.contingency.shareOfBase === null
          ? ''
          : `${signedPercent(brief.contingency.shareOfBase)} of base`,
      accent: true,
    },
  ];
  return (
    <div className="grid grid-cols-3 gap-3 break-inside-avoid">
      {boxes.map((b) => (
        <div key={b.label} className="rounded border border-rule bg-paper-raised px-3 py-2">
          <p className="text-xs text-ink-soft">{b.label}</p>
          <p
            className={`num text-left text-xl font-semibold ${b.accent ? 'text-cost-dark' : ''}`}
            data-testid={`headline-${b.label}`}
          >
            {b.value}
          </p>
          <p className="text-2xs text-ink-faint">{b.note}</p>
        </div>
      ))}
    </div>
  );
}

/** P10/P50/P80/P90 with their distribution-free 95 % intervals. */
export function PercentileTable({
  total,
  show,
  caption,
}: {
  total: TotalBrief;
  show: (v: number) => string;
  caption: string;
}) {
  return (
    <table className="w-full text-sm break-inside-avoid">
      <caption className="pb-1 text-left text-xs text-ink-soft">{caption}</caption>
      <thead>
        <tr className="border-b border-rule text-xs text-ink-soft">
          <th className="py-1 text-left font-medium">Level</th>
          <th className="num py-1 font-medium">Value</th>
          <th className="num py-1 font-medium">95 % interval</th>
          <th className="num py-1 font-medium">vs base</th>
        </tr>
      </thead>
      <tbody>
        {total.percentiles.map((p) => (
          <tr key={p.level} className="border-b border-rule" data-testid={`row-${p.level}`}>
            <td className="py-1">{p.level}</td>
            <td className="num py-1">{show(p.value)}</td>
            <td className="num py-1 text-ink-soft">
              {show(p.ci95[0])} – {show(p.ci95[1])}
            </td>
            <td className="num py-1 text-ink-soft">
              {total.base ? signedPercent(p.value / total.base - 1) : '—'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export const moneyOf = (brief: BriefData) => (v: number) => formatMoney(v, brief.project.currency);
export const daysOf = (v: number) => formatDays(v);

/** The probability of meeting each target the run was given, and of meeting both. */
export function TargetsTable({ brief }: { brief: BriefData }) {
  const rows: [string, string][] = [];
  if (brief.cost.target)
    rows.push([
      `Cost at most ${formatMoney(brief.cost.target.value, brief.project.currency)}`,
      probabilityText(brief.cost.target.probability, brief.cost.target.ci95),
    ]);
  if (brief.duration?.target)
    rows.push([
      `Finish within ${formatDays(brief.duration.target.value, 0)}${brief.run.finishTarget ? ` (by ${dateText(brief.run.finishTarget)})` : ''}`,
      probabilityText(brief.duration.target.probability, brief.duration.target.ci95),
    ]);
  if (brief.joint)
    rows.push([
      'Both targets met (joint probability)',
      probabilityText(brief.joint.probability, brief.joint.ci95),
    ]);
  if (!rows.length)
    return <p className="text-sm text-ink-faint">The run was started without a cost or finish target.</p>;
  return (
    <table className="w-full text-sm break-inside-avoid">
      <tbody>
        {rows.map(([label, value]) => (
          <tr key={label} className="border-b border-rule">
            <td className="py-1">{label}</td>
            <td className="num py-1">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function p80Of(brief: BriefData) {
  return percentileOf(brief.cost, 'P80');
}

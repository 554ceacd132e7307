import type { PercentileKey, TotalSummary } from '@/lib/sim';
import { PERCENTILE_KEYS } from '@/lib/domain/percentiles';
import { contingencyAt } from '@/lib/domain/contingency';
import { contingencyInterval } from '@/lib/runs/outcome-data';
import { formatInterval } from '@/lib/format';
import { TableHead, type HeadCell } from '@/components/ui/table';

const right = (title: string): HeadCell => ({ title, align: 'right', className: 'pl-3' });

/**
 * The P-table: each confidence level with its value and, under it, the distribution-free 95%
 * interval where the result holds one; for cost also the contingency over the base with its own
 * interval (the P-value's less the base, a constant).
 */
export function PercentileTable({
  summary,
  format,
  formatAmount = format,
  caption,
  withContingency,
  extra,
  level,
  testId,
}: {
  summary: TotalSummary;
  format: (v: number) => string;
  /** How a contingency (an amount over the base) reads; the values' own format by default. */
  formatAmount?: (v: number) => string;
  caption: string;
  withContingency?: boolean;
  /** An extra column, e.g. the finish date of a duration. */
  extra?: { title: string; cell: (v: number) => string };
  /** The chosen level, set in bold with P50. */
  level?: PercentileKey;
  testId?: string;
}) {
  const ci = summary.percentileCI95 as Partial<Record<PercentileKey, [number, number]>>;
  const interval = (c: [number, number] | null | undefined, f: (v: number) => string) =>
    c ? formatInterval(c[0], c[1], f) : 'no interval kept';
  const sub = 'block whitespace-nowrap text-2xs font-normal text-ink-faint';
  return (
    <table className="w-full border-collapse text-sm" data-testid={testId}>
      <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
        {caption}
      </caption>
      <TableHead
        look="captioned"
        cells={[
          { title: 'Level', className: 'pr-2' },
          right('Value (95 % interval)'),
          ...(extra ? [right(extra.title)] : []),
          ...(withContingency ? [right('Over base (95 % interval)')] : []),
        ]}
      />
      <tbody>
        {PERCENTILE_KEYS.map((k) => {
          const v = summary.percentiles[k];
          const strong = k === 'P50' || k === (level ?? 'P80');
          return (
            <tr key={k} className={`border-b border-rule/60 ${strong ? 'font-semibold' : ''}`} data-level={k}>
              <td className="py-0.5 pr-2 align-top">{k}</td>
              <td className="num py-0.5 pl-3">
                <span data-testid={testId ? `${testId}-${k}` : undefined}>{format(v)}</span>
                <span className={sub} data-testid={testId ? `${testId}-${k}-ci` : undefined}>
                  {interval(ci[k], format)}
                </span>
              </td>
              {extra ? <td className="num py-0.5 pl-3 align-top">{extra.cell(v)}</td> : null}
              {withContingency ? (
                <td className="num py-0.5 pl-3">
                  {formatAmount(contingencyAt(summary, k).amount)}
                  <span className={sub}>{interval(contingencyInterval(summary, k), formatAmount)}</span>
                </td>
              ) : null}
            </tr>
          );
        })}
      </tbody>
      <tfoot className="text-xs text-ink-soft">
        <tr>
          <td className="pt-1">Base</td>
          <td className="num pt-1">{format(summary.base)}</td>
          {extra ? <td className="num pt-1">{extra.cell(summary.base)}</td> : null}
          {withContingency ? <td className="num pt-1">mean {format(summary.mean)}</td> : null}
        </tr>
        {withContingency ? null : (
          <tr>
            <td className="pt-0.5">Mean</td>
            <td className="num pt-0.5">{format(summary.mean)}</td>
            {extra ? <td className="num pt-0.5">{extra.cell(summary.mean)}</td> : null}
          </tr>
        )}
      </tfoot>
    </table>
  );
}

import type { PercentileKey, TotalSummary } from '@/lib/sim';
import { PERCENTILE_KEYS } from '@/lib/domain/percentiles';
import { contingencyAt } from '@/lib/domain/contingency';
import { formatInterval } from '@/lib/format';
import { TableHead, type HeadCell } from '@/components/ui/table';

const right = (title: string): HeadCell => ({ title, align: 'right', className: 'pr-2' });

/**
 * The P-table: each confidence level with its value and, where the result holds it, the
 * distribution-free 95% interval; for cost also the contingency over the base.
 */
export function PercentileTable({
  summary,
  format,
  caption,
  withContingency,
  extra,
  testId,
}: {
  summary: TotalSummary;
  format: (v: number) => string;
  caption: string;
  withContingency?: boolean;
  /** An extra column, e.g. the finish date of a duration. */
  extra?: { title: string; cell: (v: number) => string };
  testId?: string;
}) {
  const ci = summary.percentileCI95 as Partial<Record<PercentileKey, [number, number]>>;
  return (
    <table className="w-full border-collapse text-sm" data-testid={testId}>
      <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
        {caption}
      </caption>
      <TableHead
        look="captioned"
        cells={[
          { title: 'Level', className: 'pr-2' },
          ...['Value', ...(extra ? [extra.title] : []), '95 % interval'].map(right),
          ...(withContingency ? [{ title: 'Over base', align: 'right' as const }] : []),
        ]}
      />
      <tbody>
        {PERCENTILE_KEYS.map((k) => {
          const v = summary.percentiles[k];
          const strong = k === 'P50' || k === 'P80';
          return (
            <tr key={k} className={`border-b border-rule/60 ${strong ? 'font-semibold' : ''}`} data-level={k}>
              <td className="py-0.5 pr-2">{k}</td>
              <td className="num py-0.5 pr-2" data-testid={testId ? `${testId}-${k}` : undefined}>
                {format(v)}
              </td>
              {extra ? <td className="num py-0.5 pr-2">{extra.cell(v)}</td> : null}
              <td className="num whitespace-nowrap py-0.5 pr-2 text-xs text-ink-soft">
                {ci[k] ? formatInterval(ci[k][0], ci[k][1], format) : '—'}
              </td>
              {withContingency ? (
                <td className="num py-0.5">{format(contingencyAt(summary, k).amount)}</td>
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
          <td className="num pt-1" colSpan={withContingency ? 2 : 1}>
            mean {format(summary.mean)}
          </td>
        </tr>
      </tfoot>
    </table>
  );
}

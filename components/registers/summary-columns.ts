// The computed Mean, P10 and P90 columns beside a distribution, as a row's ranges are typed.
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';

export type RowSummary = { mean: number | null; p10: number | null; p90: number | null };
type Format = NonNullable<RegisterColumn['format']>;

export function summaryColumns(
  summaryOf: (row: GridRow) => RowSummary | null,
  options: {
    meanHeader: string;
    /** Widths of the mean column and of each percentile column. */
    widths: [number, number];
    formatMean: Format;
    formatPercentile: Format;
  },
): RegisterColumn[] {
  const column = (key: keyof RowSummary, header: string, width: number, format: Format): RegisterColumn => ({
    field: `_${key}`,
    header,
    kind: 'computed',
    width,
    value: (r) => summaryOf(r)?.[key] ?? null,
    format,
    headerTooltip:
      key === 'mean'
        ? 'The mean computed from the row’s distribution'
        : `The ${header} computed from the row’s distribution (${key === 'p10' ? '10' : '90'}% of outcomes at or below)`,
  });
  const [meanWidth, width] = options.widths;
  return [
    column('mean', options.meanHeader, meanWidth, options.formatMean),
    column('p10', 'P10', width, options.formatPercentile),
    column('p90', 'P90', width, options.formatPercentile),
  ];
}

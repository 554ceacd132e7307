// The changes between two runs' inputs as people read them: each field named in words and its
// values written in their unit (money, working days, percentages), never as raw JSON.
import { formatCount, formatDays, formatMoney, formatPercent, valueText, type ValueKind } from '@/lib/format';
import type { LineKind } from './snapshot-diff';

const LABELS: Record<string, string> = {
  name: 'Name',
  base: 'Base',
  dist: 'Range',
  ratePerDay: 'Rate per day',
  activity: 'Activity',
  activities: 'Activities delayed',
  span: 'Runs with',
  probability: 'Probability',
  cost: 'Cost impact',
  delay: 'Delay',
  items: 'WBS lines',
  sizes: 'Cost and delay sizes',
  post: 'After mitigation',
  mitigationCost: 'Mitigation cost',
  duration: 'Duration',
  predecessors: 'Predecessors',
  existence: 'Chance it exists',
  rho: 'Coefficient',
  targets: 'Targets',
  settings: 'Settings',
  currency: 'Currency',
};

/** A field of a line, or of the run, named in words. */
export function fieldLabel(field: string): string {
  return LABELS[field] ?? field;
}

/** The unit of a field's numbers, by the kind of line it belongs to. */
function kindOf(line: LineKind | 'run', field: string): ValueKind {
  if (field === 'probability' || field === 'existence') return 'percent';
  if (field === 'delay' || field === 'duration' || (line === 'activity' && field === 'dist')) return 'days';
  if (['base', 'dist', 'ratePerDay', 'cost', 'mitigationCost'].includes(field)) return 'money';
  return line === 'correlation' ? 'number' : 'text';
}

/** One value of a changed field, in its unit: "30.0 %", "€1,200,000", "PERT 10 / 12 / 20". */
export function diffValueText(
  line: LineKind | 'run',
  field: string,
  value: unknown,
  currency: string,
): string {
  if (value === null || value === undefined) return '—';
  if (field === 'post' && typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([k, v]) => `${fieldLabel(k).toLowerCase()} ${diffValueText(line, k, v, currency)}`)
      .join('; ');
  }
  if (field === 'targets' && typeof value === 'object') {
    const t = value as { cost?: number; duration?: number };
    const parts = [
      t.cost !== undefined ? `cost ${formatMoney(t.cost, currency)}` : '',
      t.duration !== undefined ? `finish within ${formatDays(t.duration, 0)}` : '',
    ].filter(Boolean);
    return parts.length ? parts.join('; ') : 'none';
  }
  if (field === 'settings' && typeof value === 'object') {
    const s = value as { iterations?: number; seed?: number; sampling?: string };
    return [
      s.iterations !== undefined ? `${formatCount(s.iterations)} iterations` : '',
      s.sampling ? (s.sampling === 'lhs' ? 'Latin hypercube' : 'Monte Carlo') : '',
      s.seed !== undefined ? `seed ${s.seed}` : '',
    ]
      .filter(Boolean)
      .join(', ');
  }
  const kind = kindOf(line, field);
  if (typeof value === 'number') {
    if (kind === 'money') return formatMoney(value, currency);
    if (kind === 'days') return formatDays(value, 1);
    if (kind === 'percent') return formatPercent(value);
  }
  return valueText(value, kind === 'money' || kind === 'days' ? 'number' : kind);
}

// Money arrives in the currency's minor unit (cents); dates as ISO strings. Both are written
// through lib/format, the one place for figures.
import { formatDate, formatMoneyExact } from '@/lib/format';

export function money(cents: number | null, currency: string | null): string {
  if (cents == null || !currency) return '—';
  return formatMoneyExact(cents / 100, currency);
}

export function day(value: string | null): string {
  if (!value) return '—';
  return formatDate(value);
}

export const STATUS_LABELS: Record<string, string> = {
  none: 'No subscription',
  trialing: 'Trial',
  active: 'Active',
  past_due: 'Past due',
  unpaid: 'Unpaid',
  incomplete: 'Awaiting payment',
  incomplete_expired: 'Expired',
  canceled: 'Cancelled',
};

export const INVOICE_REASONS: Record<string, string> = {
  subscription_create: 'First period',
  subscription_cycle: 'Renewal',
  subscription_update: 'Seat change (prorated)',
  manual: 'Manual',
};

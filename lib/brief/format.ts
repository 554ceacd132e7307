// Texts the brief repeats on the page, in the PDF and in the e-mails, so that all three say
// the same figure the same way.
import { formatMoney } from '@/lib/runs/format';
import type { Interval } from '@/lib/sim';

/** "€25,340,000 (95 % interval €25,100,000 – €25,590,000)". */
export function moneyWithInterval(value: number, ci95: Interval | undefined, currency: string): string {
  const main = formatMoney(value, currency);
  if (!ci95) return main;
  return `${main} (95 % interval ${formatMoney(ci95[0], currency)} – ${formatMoney(ci95[1], currency)})`;
}

/** "12.3 %" for a probability, or with its interval: "12.3 % (95 % interval 10.9–13.8 %)". */
export function probabilityText(p: number, ci95?: Interval): string {
  const pct = (x: number) =>
    (x * 100).toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
  return ci95 ? `${pct(p)} % (95 % interval ${pct(ci95[0])}–${pct(ci95[1])} %)` : `${pct(p)} %`;
}

/** A signed share of the base: "+12 %", "−8 %"; with `digits`, "+9.6 %". */
export function signedPercent(x: number, digits = 0): string {
  const scale = 10 ** digits;
  const rounded = Math.round(x * 100 * scale) / scale;
  const sign = rounded > 0 ? '+' : rounded < 0 ? '−' : '±';
  return `${sign}${Math.abs(rounded).toFixed(digits)} %`;
}

/**
 * Dates and times in UTC with the zone named: the page, the PDF and the mail are read in
 * different places, and a figure with an unnamed zone would disagree between them.
 */
export function dateTimeText(iso: string | Date): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso;
  return `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })}, ${d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' })} UTC`;
}

export function dateText(iso: string | Date): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso;
  return d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

// Texts the brief repeats on the page, in the PDF and in the e-mails, so that all three say
// the same figure the same way. The figures themselves come from lib/format.
import {
  formatDate,
  formatDateTime,
  formatInterval,
  formatMoney,
  formatPercent,
  formatSignedPercent,
} from '@/lib/format';
import type { Interval } from '@/lib/sim';

/** "€25,340,000 (95 % interval €25,100,000 – €25,590,000)". */
export function moneyWithInterval(value: number, ci95: Interval | undefined, currency: string): string {
  const main = formatMoney(value, currency);
  if (!ci95) return main;
  return `${main} (95 % interval ${formatInterval(ci95[0], ci95[1], (v) => formatMoney(v, currency))})`;
}

/** "12.3 %" for a probability, or with its interval: "12.3 % (95 % interval 10.9 % – 13.8 %)". */
export function probabilityText(p: number, ci95?: Interval): string {
  const main = formatPercent(p);
  return ci95 ? `${main} (95 % interval ${formatInterval(ci95[0], ci95[1], (v) => formatPercent(v))})` : main;
}

/** A signed share of the base: "+12 %", "−8 %", "0 %"; with `digits`, "+9.6 %". */
export const signedPercent = (x: number, digits = 0): string => formatSignedPercent(x, digits);

/** "19 Nov 2027, 14:05 UTC". */
export const dateTimeText = (value: string | Date): string => formatDateTime(value);

/** "19 Nov 2027". */
export const dateText = (value: string | Date): string => formatDate(value);

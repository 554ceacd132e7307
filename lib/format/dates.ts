// Dates and times in one style: "19 Nov 2027", and "19 Nov 2027, 14:05 UTC" when the time
// matters. Times are in UTC with the zone named: the page, the PDF and the mail are read in
// different places, and a time with an unnamed zone would disagree between them.
import { LOCALE } from './locale';

const dayFormat = new Intl.DateTimeFormat(LOCALE, {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});
const timeFormat = new Intl.DateTimeFormat(LOCALE, { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' });

/** A calendar day ("2027-11-19") or an instant, read in UTC. */
function toDate(value: string | Date): Date {
  if (value instanceof Date) return value;
  return new Date(/^\d{4}-\d{2}-\d{2}$/.test(value) ? `${value}T00:00:00Z` : value);
}

/** "19 Nov 2027". */
export function formatDate(value: string | Date): string {
  return dayFormat.format(toDate(value));
}

/** "19 Nov 2027, 14:05 UTC". */
export function formatDateTime(value: string | Date): string {
  const d = toDate(value);
  return `${dayFormat.format(d)}, ${timeFormat.format(d)} UTC`;
}

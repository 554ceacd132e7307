// Number formats for the outcome screens: money in the project's currency, working days,
// shares, and the time left of a run.

const moneyFormats = new Map<string, Intl.NumberFormat>();

/** Whole units of the currency with thousands separators, e.g. "€12,345,678". */
export function formatMoney(value: number, currency: string): string {
  const key = currency;
  let f = moneyFormats.get(key);
  if (!f) {
    try {
      f = new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 0 });
    } catch {
      // An unknown code still shows the figure, with the code in front.
      f = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
    }
    moneyFormats.set(key, f);
  }
  return f.format(value);
}

/** Short money for chart axes and markers, three significant digits: "€12.3m", "€850k". */
export function formatMoneyShort(value: number, currency: string): string {
  try {
    return new Intl.NumberFormat('en-GB', {
      style: 'currency',
      currency,
      notation: 'compact',
      maximumSignificantDigits: 3,
    }).format(value);
  } catch {
    return new Intl.NumberFormat('en-GB', { notation: 'compact', maximumSignificantDigits: 3 }).format(value);
  }
}

export function formatDays(value: number, digits = 1): string {
  return `${value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })} wd`;
}

export function formatShare(p: number, digits = 1): string {
  return `${(p * 100).toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })} %`;
}

export function formatCount(n: number): string {
  return n.toLocaleString('en-GB');
}

/** "about 12 s", "about 3 min": the remaining time of a run, rounded as a person would say it. */
export function formatTimeLeft(ms: number): string {
  if (!Number.isFinite(ms) || ms < 0) return 'estimating…';
  const s = Math.ceil(ms / 1000);
  if (s < 60) return `about ${s} s`;
  const m = Math.round(s / 60);
  if (m < 60) return `about ${m} min`;
  return `about ${Math.floor(m / 60)} h ${m % 60} min`;
}

const dateFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** An ISO date as "19 Nov 2027". */
export function formatDate(iso: string): string {
  return dateFormat.format(new Date(`${iso}T00:00:00Z`));
}

/** A signed change, "+€1,250" or "−3.5 wd"; a change that rounds to nothing shows as "0". */
export function formatChange(delta: number, format: (v: number) => string): string {
  const shown = format(Math.abs(delta));
  if (!/[1-9]/.test(shown)) return '0';
  return `${delta >= 0 ? '+' : '−'}${shown}`;
}

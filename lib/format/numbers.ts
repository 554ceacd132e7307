// Numbers, money, working days and percentages, each in one style on every screen. Every
// function writes negatives with the true minus sign and never shows "−0".
import { LOCALE, signed } from './locale';

const cache = new Map<string, Intl.NumberFormat>();
function numberFormat(key: string, make: () => Intl.NumberFormat): Intl.NumberFormat {
  let f = cache.get(key);
  if (!f) {
    f = make();
    cache.set(key, f);
  }
  return f;
}

function currencyFormat(currency: string, options: Intl.NumberFormatOptions, key: string) {
  return numberFormat(`${key}:${currency}`, () => {
    try {
      return new Intl.NumberFormat(LOCALE, {
        style: 'currency',
        currency: currency.toUpperCase(),
        ...options,
      });
    } catch {
      // An unknown code still shows the figure.
      return new Intl.NumberFormat(LOCALE, options);
    }
  });
}

/** A plain number with thousands separators and up to `maxDigits` decimals: "1,234.5", "−12". */
export function formatNumber(value: number, maxDigits = 2, minDigits = 0): string {
  const f = numberFormat(
    `n:${minDigits}:${maxDigits}`,
    () =>
      new Intl.NumberFormat(LOCALE, { minimumFractionDigits: minDigits, maximumFractionDigits: maxDigits }),
  );
  return signed(value, f.format(Math.abs(value)));
}

/** A whole count: "12,000". */
export function formatCount(n: number): string {
  return formatNumber(n, 0);
}

/** Whole units of the currency with thousands separators: "€12,345,678", "−£950". */
export function formatMoney(value: number, currency: string): string {
  return signed(value, currencyFormat(currency, { maximumFractionDigits: 0 }, 'm').format(Math.abs(value)));
}

/** Money with its minor unit, for invoices and prices: "€1,234.50". */
export function formatMoneyExact(value: number, currency: string): string {
  return signed(value, currencyFormat(currency, {}, 'x').format(Math.abs(value)));
}

/** Short money for chart axes and markers, three significant digits: "€12.3m", "€850k". */
export function formatMoneyShort(value: number, currency: string): string {
  const f = currencyFormat(currency, { notation: 'compact', maximumSignificantDigits: 3 }, 's');
  return signed(value, f.format(Math.abs(value)));
}

/** Working days: "190.0 wd". */
export function formatDays(value: number, digits = 1): string {
  return `${formatNumber(value, digits, digits)} wd`;
}

/**
 * A share or a probability (0.123) as a percentage in the one style: "12.3 %" (a space before
 * the sign, one decimal unless asked otherwise). Tiny non-zero shares say so rather than "0.0 %".
 */
export function formatPercent(share: number, digits = 1): string {
  const text = `${formatNumber(share * 100, digits, digits)} %`;
  // A share too small to show is not nothing: "< 0.1 %".
  if (share > 0 && !/[1-9]/.test(text)) return `< ${formatNumber(10 ** -digits, digits, digits)} %`;
  return text;
}

/** A signed share of something, "+12 %", "−8 %", "0 %": changes against a base. */
export function formatSignedPercent(share: number, digits = 0): string {
  const unsigned = `${formatNumber(Math.abs(share) * 100, digits, digits)} %`;
  return signed(share, unsigned, true);
}

/** A signed change, "+€1,250" or "−3.5 wd"; a change that rounds to nothing shows as "0". */
export function formatChange(delta: number, format: (v: number) => string): string {
  const shown = format(Math.abs(delta));
  if (!/[1-9]/.test(shown)) return '0';
  return signed(delta, shown, true);
}

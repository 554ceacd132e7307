// Reading numbers typed or pasted by people as spreadsheets show them: "1 250 000",
// "1,250,000.50", "£95,000", "€1.2m", "EUR 40k", "(1,200)", "30%", "'0042" (a leading apostrophe
// marks a spreadsheet cell as text). What cannot be read comes back as the text itself, so the
// cell can say why it was refused rather than silently holding a wrong figure. Figures are written
// in the grids through the one format of lib/format.
import { formatNumber as formatPlainNumber } from '@/lib/format';

// Spaces a spreadsheet or a locale puts between thousands: space, no-break space, narrow no-break space.
const SPACES = /[\s\u00a0\u202f]/g;
const CURRENCY_SIGNS = /[£€$¥₹₩₽¤]/g;
// A code such as EUR, GBP or USD before or after the figure (ISO 4217 codes are three letters).
const CURRENCY_CODE = /^([A-Z]{3})(?=[\d.+\-−(])|(?<=[\d.)])([A-Z]{3})$/;
const SCALES: Record<string, number> = { k: 1e3, m: 1e6, mn: 1e6, bn: 1e9, b: 1e9 };

/** A number from text, null for an empty cell, or the trimmed text itself when it is not a number. */
export function readNumber(input: unknown): number | null | string {
  if (input === null || input === undefined) return null;
  if (typeof input === 'number') return Number.isFinite(input) ? input : String(input);
  const text = String(input).trim().replace(/^'/, '').trim();
  if (text === '') return null;
  const n = parseFigure(text);
  return n === null ? text : n;
}

function parseFigure(text: string): number | null {
  let s = text.replace(SPACES, '').replace(/\u2212/g, '-');
  let sign = 1;
  // Accounting style: (1,200) is minus 1,200.
  const paren = /^\((.*)\)$/.exec(s);
  if (paren) {
    s = paren[1];
    sign = -1;
  }
  s = s.replace(CURRENCY_CODE, '');
  const lead = /^([+-])?[£€$¥₹₩₽¤]?([+-])?/.exec(s)!;
  const signs = (lead[1] ?? '') + (lead[2] ?? '');
  if (signs.length > 1) return null;
  if (signs === '-') sign = -sign;
  s = s.slice(lead[0].length).replace(CURRENCY_SIGNS, '');
  let factor = 1;
  if (s.endsWith('%')) {
    factor = 0.01;
    s = s.slice(0, -1);
  } else {
    const scale = /(k|mn|m|bn|b)$/i.exec(s);
    if (scale && /\d$/.test(s.slice(0, -scale[0].length))) {
      factor = SCALES[scale[1].toLowerCase()];
      s = s.slice(0, -scale[0].length);
    }
  }
  // Thousands separators: commas followed by three digits (1,250,000.50).
  if (/^\d{1,3}(,\d{3})+(\.\d*)?$/.test(s)) s = s.replace(/,/g, '');
  if (!/^(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(s)) return null;
  const value = sign * Number(s) * factor;
  // Scaling by 1e6 can leave 1.2 × 1e6 = 1199999.9999999998: round to the digits typed.
  return Number.isFinite(value) ? Number(value.toPrecision(15)) : null;
}

/** A probability from text: "30%" or "30" → 0.3, "0.3" → 0.3. */
export function readProbability(input: unknown): number | null | string {
  const n = readNumber(input);
  if (typeof input === 'string' && input.trim().endsWith('%')) return n;
  return typeof n === 'number' && n > 1 ? n / 100 : n;
}

/** A grid's money cell: "1,250,000", "−50,000" (the true minus sign, never "−0"). */
export function formatMoney(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return formatPlainNumber(value, digits, digits);
}

export function formatNumber(value: number | null | undefined, maxDigits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return formatPlainNumber(value, maxDigits);
}

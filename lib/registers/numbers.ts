// Reading numbers typed or pasted by people: "1 250 000", "1,250,000.50", "12.5%".

/** A number from text, null for an empty cell, or the trimmed text itself when it is not a number. */
export function readNumber(input: unknown): number | null | string {
  if (input === null || input === undefined) return null;
  if (typeof input === 'number') return Number.isFinite(input) ? input : String(input);
  const text = String(input).trim();
  if (text === '') return null;
  const cleaned = text.replace(/[\s\u00a0\u202f]/g, '').replace(/,(?=\d{3}(\D|$))/g, '');
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(cleaned)) return text;
  return Number(cleaned);
}

/** A probability from text: "30%" or "30" → 0.3, "0.3" → 0.3. */
export function readProbability(input: unknown): number | null | string {
  if (typeof input === 'string' && input.trim().endsWith('%')) {
    const n = readNumber(input.trim().slice(0, -1));
    return typeof n === 'number' ? n / 100 : n;
  }
  const n = readNumber(input);
  return typeof n === 'number' && n > 1 ? n / 100 : n;
}

export function formatMoney(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

export function formatNumber(value: number | null | undefined, maxDigits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return value.toLocaleString('en-GB', { maximumFractionDigits: maxDigits });
}

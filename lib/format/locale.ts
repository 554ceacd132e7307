// The one locale every figure is written in: the product speaks British English to every
// project, so dates read "19 Nov 2027" and numbers "1,234.5" on every screen, in the PDF and in
// every mail. Changing the locale here changes it everywhere.
export const LOCALE = 'en-GB';

/** The true minus sign (U+2212), wider than the hyphen and aligned with the plus. */
export const MINUS = '\u2212';

/**
 * A figure's sign in front of its unsigned text, never "−0": a value that rounds to zero in the
 * shown digits is shown unsigned. `plus` writes "+" for positives (changes), else nothing.
 */
export function signed(value: number, unsignedText: string, plus = false): string {
  if (!/[1-9]/.test(unsignedText)) return unsignedText;
  if (value < 0) return `${MINUS}${unsignedText}`;
  return plus && value > 0 ? `+${unsignedText}` : unsignedText;
}

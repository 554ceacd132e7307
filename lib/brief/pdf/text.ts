/**
 * pdfkit's built-in Helvetica encodes text as WinAnsi (Windows-1252): characters outside it
 * would print as garbage. The few that our texts use are mapped to their nearest WinAnsi form.
 */
const REPLACEMENTS: Record<string, string> = {
  '\u2212': '-', // minus sign
  '\u2264': '<=',
  '\u2265': '>=',
  '\u00d7': '\u00d7', // × is in WinAnsi
  '\u202f': ' ', // narrow no-break space
  '\u2009': ' ', // thin space
  '\u2248': '~',
  '\u2192': '->',
};

export function pdfText(text: string): string {
  return text.replace(/[\u2212\u2264\u2265\u202f\u2009\u2248\u2192]/g, (c) => REPLACEMENTS[c] ?? '?');
}

// A text cell that begins with = + - @ (or a tab or carriage return) can be run as a formula
// by a spreadsheet program opening the file: exported text gets a leading apostrophe, which
// spreadsheets show as plain text. Import strips that apostrophe again so a round trip is
// lossless.

const FORMULA_START = /^[=+\-@\t\r]/;

export function escapeSpreadsheetText(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

export function unescapeSpreadsheetText(value: string): string {
  return value.startsWith("'") && FORMULA_START.test(value.slice(1)) ? value.slice(1) : value;
}

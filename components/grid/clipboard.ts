// A block copied from a spreadsheet arrives as tab-separated text, one line per row; cells
// holding tabs, newlines or quotes are quoted ("…", with "" for a quote).

export function parseClipboardBlock(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  const body = text.replace(/\r\n?/g, '\n').replace(/\n$/, '');
  for (let i = 0; i < body.length; i++) {
    const ch = body[i];
    if (quoted) {
      if (ch === '"' && body[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell === '') quoted = true;
    else if (ch === '\t') {
      row.push(cell);
      cell = '';
    } else if (ch === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
    } else cell += ch;
  }
  row.push(cell);
  rows.push(row);
  return rows.length === 1 && rows[0].length === 1 && rows[0][0] === '' ? [] : rows;
}

/** A block of cells as tab-separated text for the clipboard. */
export function formatClipboardBlock(rows: (string | number | null | undefined)[][]): string {
  return rows
    .map((r) =>
      r
        .map((v) => {
          const s = v === null || v === undefined ? '' : String(v);
          return /[\t\n"]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
        })
        .join('\t'),
    )
    .join('\n');
}

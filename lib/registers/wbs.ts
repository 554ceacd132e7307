// WBS codes are dotted ("2.3.1"): the level is the number of parts, used to indent the grid.

export function wbsLevel(code: string): number {
  const parts = code.split('.').filter((p) => p.trim() !== '');
  return Math.max(1, parts.length);
}

/** The level-1 part of a WBS code ("2" for "2.3.1"), used for subtotals. */
export function wbsRoot(code: string): string {
  return code.split('.')[0] ?? code;
}

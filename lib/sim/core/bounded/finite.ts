/**
 * Parts travel as JSON, where NaN and ±Infinity become null: a part must hold finite numbers
 * only, or it would come back changed. A run whose totals are not finite fails here, naming the
 * chunk, instead of losing the numbers on the way.
 */

export function assertFinite(what: string, ...lists: (ArrayLike<number> | number | null)[]): void {
  for (const list of lists) {
    if (list === null) continue;
    const values = typeof list === 'number' ? [list] : list;
    for (let i = 0; i < values.length; i++)
      if (!Number.isFinite(values[i]))
        throw new RangeError(`bounded run: ${what} holds a number that is not finite (${values[i]})`);
  }
}

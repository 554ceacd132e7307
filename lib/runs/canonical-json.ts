/**
 * Canonical JSON: object keys sorted, no whitespace, numbers as JSON.stringify writes them.
 * Two snapshots with the same content give the same text whatever the order their keys were
 * built in, so their hashes agree.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    const text = JSON.stringify(value);
    // undefined and functions have no JSON form; as object members they are dropped below.
    return text === undefined ? 'null' : text;
  }
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.keys(value as Record<string, unknown>)
    .sort()
    .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
    .map((k) => `${JSON.stringify(k)}:${canonicalJson((value as Record<string, unknown>)[k])}`);
  return `{${entries.join(',')}}`;
}

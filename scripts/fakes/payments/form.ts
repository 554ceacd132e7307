// Decodes the payment SDK's form bodies and query strings (`items[0][quantity]=5`,
// `expand[0]=subscription`) into nested objects and arrays, as the real service does.

export type Params = { [key: string]: ParamValue };
export type ParamValue = string | Params | ParamValue[];

function keyPath(key: string): string[] {
  const head = key.split('[', 1)[0];
  const rest = [...key.slice(head.length).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1]);
  return [head, ...rest];
}

function setPath(target: Params, path: string[], value: string) {
  let node: Params | ParamValue[] = target;
  path.forEach((segment, i) => {
    const last = i === path.length - 1;
    const nextIsIndex = !last && /^\d*$/.test(path[i + 1]);
    const slot: string | number = Array.isArray(node)
      ? segment === ''
        ? node.length
        : Number(segment)
      : segment;
    const container = node as Record<string | number, ParamValue>;
    if (last) {
      container[slot] = value;
      return;
    }
    if (container[slot] === undefined || typeof container[slot] === 'string') {
      container[slot] = nextIsIndex ? [] : {};
    }
    node = container[slot] as Params | ParamValue[];
  });
}

export function decodeParams(encoded: string): Params {
  const params: Params = {};
  for (const [key, value] of new URLSearchParams(encoded)) setPath(params, keyPath(key), value);
  return params;
}

/** Reads a string parameter, or undefined. */
export function str(params: Params | undefined, key: string): string | undefined {
  const v = params?.[key];
  return typeof v === 'string' ? v : undefined;
}

/** Reads a nested object parameter, or undefined. */
export function obj(params: Params | undefined, key: string): Params | undefined {
  const v = params?.[key];
  return v && typeof v === 'object' && !Array.isArray(v) ? v : undefined;
}

/** Reads an array parameter (indexed keys), or an empty array. */
export function list(params: Params | undefined, key: string): ParamValue[] {
  const v = params?.[key];
  return Array.isArray(v) ? v.filter((x) => x !== undefined) : [];
}

/** String values of a flat object parameter (metadata). */
export function stringMap(params: Params | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(params ?? {})) if (typeof v === 'string') out[k] = v;
  return out;
}

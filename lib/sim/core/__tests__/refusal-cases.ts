// Bad models as data (tests/fixtures/sim/*-cases.json): each case names what it refuses, the
// fields to delete and to set in a good model (dot paths, array positions as numbers), and the
// message the validator must give for it.
import { readFileSync } from 'node:fs';

export type RefusalCase = {
  refuses: string;
  delete?: string[];
  set?: Record<string, unknown>;
  message: string;
};

export const readCases = (file: string): RefusalCase[] => JSON.parse(readFileSync(file, 'utf8'));

/** Makes a case's edits to a model, in place. */
export function applyCase(model: object, c: RefusalCase): void {
  const at = (path: string) => {
    const keys = path.split('.');
    const last = keys.pop()!;
    const parent = keys.reduce((o, k) => o[k] as Record<string, unknown>, model as Record<string, unknown>);
    return { parent, last };
  };
  for (const path of c.delete ?? []) {
    const { parent, last } = at(path);
    delete parent[last];
  }
  for (const [path, value] of Object.entries(c.set ?? {})) {
    const { parent, last } = at(path);
    parent[last] = value;
  }
}

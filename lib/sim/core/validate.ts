// validateModel: unknown JSON → a typed Model, or messages that each name the offending entry
// (`items[3] (C4).dist.mode: …`), in the { path, message } shape the app's errors use.

import type { z } from 'zod';
import { ModelValidationError } from './errors';
import { modelSchema } from './schema';
import type { Model } from './formats';

export interface FieldIssue {
  path: string;
  message: string;
}

export type ValidationResult = { ok: true; model: Model } | { ok: false; issues: FieldIssue[] };

type Issue = z.core.$ZodIssue;
type Path = readonly PropertyKey[];

function at(raw: unknown, path: Path): unknown {
  let node = raw;
  for (const seg of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[seg];
  }
  return node;
}

function entryLabel(node: unknown): string | null {
  if (node === null || typeof node !== 'object') return null;
  const o = node as Record<string, unknown>;
  if (typeof o.id === 'string' && o.id) return o.id;
  if (typeof o.a === 'string' && typeof o.b === 'string') return `${o.a}–${o.b}`;
  return null;
}

/** ['items', 3, 'dist', 'mode'] → "items[3] (C4).dist.mode". */
export function formatPath(path: Path, raw: unknown): string {
  let out = '';
  for (let i = 0; i < path.length; i++) {
    const seg = path[i];
    if (typeof seg === 'number') {
      out += `[${seg}]`;
      const label = entryLabel(at(raw, path.slice(0, i + 1)));
      if (label) out += ` (${label})`;
    } else out += out ? `.${String(seg)}` : String(seg);
  }
  return out;
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'object') return 'an object';
  return String(value);
}

const article = (word: string) => (/^[aeiou]/.test(word) ? `an ${word}` : `a ${word}`);

function messageOf(issue: Issue, raw: unknown, base: Path): string {
  const value = at(raw, [...base, ...issue.path]);
  switch (issue.code) {
    case 'invalid_type':
      if (value === undefined) return 'is required';
      return `must be ${article(issue.expected === 'int' ? 'integer' : issue.expected)} (got ${describe(value)})`;
    case 'invalid_union':
      if ('discriminator' in issue && issue.discriminator) {
        const options = (issue as { options?: unknown[] }).options ?? [];
        return `must be one of ${options.join(', ')} (got ${describe(value)})`;
      }
      return 'must be a number or a distribution';
    case 'invalid_value':
      return `must be ${issue.values.map((v) => JSON.stringify(v)).join(' or ')} (got ${describe(value)})`;
    case 'unrecognized_keys':
      return `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')}`;
    case 'too_small':
      if (issue.origin === 'string') return 'must not be empty';
      if (issue.origin === 'array') return `must list at least ${String(issue.minimum)} (got none)`;
      return `must be ${issue.inclusive ? '≥' : '>'} ${String(issue.minimum)} (got ${describe(value)})`;
    case 'too_big':
      return `must be ${issue.inclusive ? '≤' : '<'} ${String(issue.maximum)} (got ${describe(value)})`;
    default:
      return issue.message;
  }
}

/** A union of a number and a distribution fails as a whole; report the branch that fits the value. */
function flatten(issue: Issue, raw: unknown, base: Path): { path: Path; message: string }[] {
  if (issue.code === 'invalid_union' && !('discriminator' in issue && issue.discriminator)) {
    const value = at(raw, [...base, ...issue.path]);
    const branches = issue.errors ?? [];
    const pickObject = value !== null && typeof value === 'object';
    const branch = branches.find((b) =>
      pickObject ? b.some((i) => i.code !== 'invalid_type' || i.path.length > 0) : false,
    );
    if (branch) {
      const nested = [...base, ...issue.path];
      return branch.flatMap((i) => flatten(i as Issue, raw, nested));
    }
  }
  return [{ path: [...base, ...issue.path], message: messageOf(issue, raw, base) }];
}

export function validateModel(input: unknown): ValidationResult {
  const parsed = modelSchema.safeParse(input);
  if (parsed.success) return { ok: true, model: parsed.data as Model };
  const issues = parsed.error.issues
    .flatMap((i) => flatten(i as Issue, input, []))
    .map((i) => ({ path: formatPath(i.path, input), message: i.message }));
  return { ok: false, issues };
}

/** Like validateModel, but throws ModelValidationError. */
export function parseModel(input: unknown): Model {
  const r = validateModel(input);
  if (!r.ok) throw new ModelValidationError(r.issues);
  return r.model;
}

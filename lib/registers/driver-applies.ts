// What a risk driver applies to, as the estimator types it: codes of line items and activities,
// and WBS branches ("3.*", "3.x" or "all of 3.x": the line 3 and every line below it). The
// branch is stored as typed, so lines added under it later join; it is resolved to codes only
// when the model is built (and to show what it covers today).

export type AppliesToken =
  { text: string; kind: 'code'; code: string } | { text: string; kind: 'branch'; prefix: string };

/** "3.*", "3.x", "3.X", "all of 3.x", "all of 3" → the branch 3; anything else is a code. */
export function parseToken(raw: string): AppliesToken {
  const text = raw.trim();
  const all = /^all\s+of\s+(.+)$/i.exec(text);
  const body = all ? all[1].trim() : text;
  const star = /^(.+?)\.(\*|x|X)$/.exec(body);
  if (star) return { text, kind: 'branch', prefix: star[1] };
  if (all) return { text, kind: 'branch', prefix: body };
  return { text, kind: 'code', code: text };
}

/** The typed list: a list already, or text split on commas, semicolons and new lines. */
export function splitApplies(value: unknown): string[] {
  const parts = Array.isArray(value)
    ? value.map(String)
    : typeof value === 'string'
      ? value.split(/[,;\n]+/)
      : [];
  return parts.map((p) => p.trim()).filter((p) => p !== '');
}

/** Whether a code is the branch's head or lies below it ("3", "3.1", "3.1.4" for the branch 3). */
export function inBranch(code: string, prefix: string): boolean {
  return code === prefix || code.startsWith(`${prefix}.`);
}

export type AppliesTargets = { items: readonly string[]; activities: readonly string[] };

export type Resolution = {
  /** The codes covered, in the registers' order (line items, then activities), each once. */
  codes: string[];
  /** Tokens that cover nothing, with why, in words a user reads. */
  problems: { token: string; message: string }[];
};

/** The line items and activities a typed list covers today. */
export function resolveApplies(
  typed: readonly string[],
  targets: AppliesTargets,
  others: ReadonlySet<string> = new Set(),
): Resolution {
  const wanted = new Set<string>();
  const problems: Resolution['problems'] = [];
  const all = [...targets.items, ...targets.activities];
  const known = new Set(all);
  for (const raw of typed) {
    const token = parseToken(raw);
    if (token.kind === 'code') {
      if (known.has(token.code)) wanted.add(token.code);
      else if (others.has(token.code))
        problems.push({
          token: raw,
          message: `${token.code} is not a line item or an activity; a driver scales those only.`,
        });
      else problems.push({ token: raw, message: `unknown code "${token.code}".` });
      continue;
    }
    const hits = all.filter((c) => inBranch(c, token.prefix));
    if (hits.length === 0)
      problems.push({ token: raw, message: `"${raw}" covers no line item or activity.` });
    for (const c of hits) wanted.add(c);
  }
  return { codes: all.filter((c) => wanted.has(c)), problems };
}

/** "12 lines, 2 activities" (short enough for a grid cell). */
export function describeResolution(codes: readonly string[], targets: AppliesTargets): string {
  const items = new Set(targets.items);
  const nItems = codes.filter((c) => items.has(c)).length;
  const nActs = codes.length - nItems;
  const part = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
  const out = [];
  if (nItems) out.push(part(nItems, 'line', 'lines'));
  if (nActs) out.push(part(nActs, 'activity', 'activities'));
  return out.length ? out.join(', ') : 'nothing';
}

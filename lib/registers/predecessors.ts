// Predecessors typed as text in the schedule grid: "A1, A3+5, A4-2" means finish-to-start
// after A1, after A3 with a 5-working-day lag, and after A4 with a 2-day lead.
// Activity codes may contain dashes, so a trailing "-2" is read as a lead only when the
// whole token is not itself a known code.

export type PredecessorLink = { code: string; lag: number };

export type PredecessorParse = { ok: true; links: PredecessorLink[] } | { ok: false; error: string };

const CODE = /^[A-Za-z0-9][A-Za-z0-9._\-/]*$/;
const WITH_LAG = /^(.+?)\s*([+-])\s*(\d+(?:\.\d+)?)\s*d?$/i;

export function parsePredecessors(text: string, knownCodes?: ReadonlySet<string>): PredecessorParse {
  const links: PredecessorLink[] = [];
  const seen = new Set<string>();
  const tokens = text
    .split(/[,;\n]/)
    .map((t) => t.trim())
    .filter(Boolean);
  for (const token of tokens) {
    let code = token;
    let lag = 0;
    const known = knownCodes?.has(token);
    const m = known ? null : WITH_LAG.exec(token);
    if (m) {
      code = m[1].trim();
      lag = Number(m[3]) * (m[2] === '-' ? -1 : 1);
    }
    if (!CODE.test(code)) {
      return {
        ok: false,
        error: `"${token}" is not an activity code (write e.g. A1 or A3+5 for a 5-day lag)`,
      };
    }
    if (seen.has(code)) return { ok: false, error: `${code} is listed twice` };
    seen.add(code);
    links.push({ code, lag });
  }
  return { ok: true, links };
}

export function formatPredecessors(links: readonly PredecessorLink[]): string {
  return links
    .map((l) => (l.lag > 0 ? `${l.code}+${l.lag}` : l.lag < 0 ? `${l.code}${l.lag}` : l.code))
    .join(', ');
}

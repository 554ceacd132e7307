// Predecessors typed as text in the schedule grid, in our own compact notation: each link is an
// activity code, then optionally a two-letter link type and a signed lag in working days.
//   "A2"          finish-to-start, no lag
//   "A3+5"        finish-to-start with a 5-day lag ("A4-2": a 2-day lead)
//   "A3 SS+2"     start-to-start, starting 2 days after A3 starts
//   "A4 FF-1"     finish-to-finish, finishing no earlier than 1 day before A4 finishes
//   "A5 SF"       start-to-finish, no lag
// Links are separated by commas (or semicolons, or new lines). One link of each type per
// predecessor (an SS and an FF link from the same activity is a common pair).
// Activity codes may contain dashes, so a trailing "-2" is read as a lead only when the
// whole token is not itself a known code.

import type { LinkType, Predecessor } from '@/lib/sim';

export type { LinkType };

/** A stored link; `type` is left out for finish-to-start (links stored before link types). */
export type PredecessorLink = { code: string; type?: LinkType; lag: number };

export type PredecessorParse = { ok: true; links: PredecessorLink[] } | { ok: false; error: string };

/** The notation in a few words, for the cell's help and the error messages. */
export const PREDECESSOR_HELP =
  'Activity codes separated by commas. After a code, a link type (FS finish-to-start, the default; ' +
  'SS start-to-start; FF finish-to-finish; SF start-to-finish) and a lag in working days, ' +
  'negative for a lead: A2, A3 SS+2, A4 FF-1, A5+3.';

const CODE = /^[A-Za-z0-9][A-Za-z0-9._\-/]*$/;
const LAG = String.raw`([+\-−])\s*(\d+(?:\.\d+)?)\s*d?`;
const WITH_TYPE = new RegExp(String.raw`^(.+?)\s+(FS|SS|FF|SF)\s*(?:${LAG})?$`, 'i');
const WITH_LAG = new RegExp(String.raw`^(.+?)\s*${LAG}$`, 'i');

const linkTypeOf = (t: string) => t.toUpperCase() as LinkType;
const lagOf = (sign: string, digits: string) => Number(digits) * (sign === '+' ? 1 : -1);

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
    let type: LinkType = 'FS';
    const known = knownCodes?.has(token);
    const typed = known ? null : WITH_TYPE.exec(token);
    const lagged = known || typed ? null : WITH_LAG.exec(token);
    if (typed) {
      code = typed[1].trim();
      type = linkTypeOf(typed[2]);
      if (typed[3]) lag = lagOf(typed[3], typed[4]);
    } else if (lagged) {
      code = lagged[1].trim();
      lag = lagOf(lagged[2], lagged[3]);
    }
    if (!CODE.test(code)) {
      return {
        ok: false,
        error: `"${token}" is not a link: write a code, then if needed a type and a signed lag (e.g. A2, A3 SS+2, A4 FF-1).`,
      };
    }
    const key = `${code} ${type}`;
    if (seen.has(key)) {
      return { ok: false, error: `${code} is listed twice${type === 'FS' ? '' : ` with ${type}`}` };
    }
    seen.add(key);
    links.push(type === 'FS' ? { code, lag } : { code, type, lag });
  }
  return { ok: true, links };
}

/** A stored link as the model file writes it: a plain id for FS without lag. */
export function linkToModel(l: PredecessorLink): Predecessor {
  const type = l.type ?? 'FS';
  if (type === 'FS') return l.lag ? { id: l.code, lag: l.lag } : l.code;
  return l.lag ? { id: l.code, type, lag: l.lag } : { id: l.code, type };
}

/** A model file's predecessor as a stored link. */
export function linkFromModel(p: Predecessor): PredecessorLink {
  if (typeof p === 'string') return { code: p, lag: 0 };
  const type = p.type ?? 'FS';
  return type === 'FS' ? { code: p.id, lag: p.lag ?? 0 } : { code: p.id, type, lag: p.lag ?? 0 };
}

const signedLag = (lag: number) => (lag > 0 ? `+${lag}` : lag < 0 ? `${lag}` : '');

/** One link in the notation: "A2", "A3+5", "A3 SS+2", "A5 SF". */
export function formatLink(l: PredecessorLink): string {
  const type = l.type ?? 'FS';
  return type === 'FS' ? `${l.code}${signedLag(l.lag)}` : `${l.code} ${type}${signedLag(l.lag)}`;
}

export function formatPredecessors(links: readonly PredecessorLink[]): string {
  return links.map(formatLink).join(', ');
}

// How often and how long a failed send is tried again: the delay doubles from 15 s and is
// capped at one hour, so eight attempts span about an hour of SMTP outage.

export const MAX_ATTEMPTS = 8;
const FIRST_RETRY_MS = 15_000;
const LONGEST_RETRY_MS = 60 * 60_000;

/** Delay before the next try after `attempts` failures: 15 s, 30 s, 1 min, … at most 1 hour. */
export function retryDelayMs(attempts: number): number {
  return Math.min(LONGEST_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.max(0, attempts - 1));
}

import { createHash } from 'node:crypto';
import { canonicalJson } from './canonical-json';

/** SHA-256 (hex) of the snapshot's canonical JSON: the run's reproducibility fingerprint. */
export function snapshotHash(snapshot: unknown): string {
  return createHash('sha256').update(canonicalJson(snapshot), 'utf8').digest('hex');
}

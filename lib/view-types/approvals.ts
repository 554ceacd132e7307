// What the pages see of a sponsor's decision: a plain JSON shape that the service produces and the
// components render. No server code here, so client components may import it.
import type { Decision } from '@/models/approval';

export type DecisionView = {
  id: number;
  runId: number;
  /** The run's number within its project, the name people read (Run 1 is its first run). */
  runNumber: number;
  decision: Decision;
  comment: string;
  sponsorName: string;
  stage: string;
  estimateClass: number;
  decidedAt: string;
};

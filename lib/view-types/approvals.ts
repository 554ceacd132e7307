// What the pages see of a sponsor's decision: a plain JSON shape that the service produces and the
// components render. No server code here, so client components may import it.
import type { Decision } from '@/models/approval';

export type DecisionView = {
  id: number;
  runId: number;
  decision: Decision;
  comment: string;
  sponsorName: string;
  stage: string;
  estimateClass: number;
  decidedAt: string;
};

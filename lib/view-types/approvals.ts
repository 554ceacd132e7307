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
  /** Approved by the person who started the run (the organisation allows it). */
  selfApproved: boolean;
};

/** A brief put before the sponsors that awaits a decision. */
export type AwaitingBrief = {
  projectId: number;
  projectCode: string;
  projectName: string;
  runId: number;
  sentAt: string;
  sentByName: string;
  /** The person looking started this run (by default they may not approve it). */
  startedByYou: boolean;
};

// What the pages see of a project: a plain JSON shape that the service produces and the
// components render. No server code here, so client components may import it.

export type ProjectView = {
  id: number;
  name: string;
  code: string;
  currency: string;
  estimateClass: number;
  stage: string;
  baseDate: string;
  description: string | null;
  /** The cost target and finish target (YYYY-MM-DD) each new run starts with; null when none. */
  costTarget: number | null;
  finishTarget: string | null;
  archived: boolean;
  version: number;
};

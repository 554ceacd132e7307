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
  archived: boolean;
  version: number;
};

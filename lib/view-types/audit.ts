// What the pages see of a project's audit trail. The registers service produces it; no server
// code here, so client components may import it.

export type AuditView = {
  id: number;
  at: string;
  who: string;
  entity: string;
  entityId: string | null;
  action: string;
  before: unknown;
  after: unknown;
  /** As people read it: "Changed", "line item 1.2 Sheet piling", ["Low: 80,000 → 85,000"]. */
  what: string;
  subject: string;
  changes: string[];
};

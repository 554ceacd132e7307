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
};

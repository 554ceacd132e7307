// A register page's registers, sent along with its HTML (see ../../query-prefill.tsx): the grid
// draws its rows as soon as the page is hydrated.
import type { Actor } from '@/lib/auth/actor';
import { listRegisters } from '@/lib/services/registers/read';
import { registerQueryKey } from '@/lib/registers/query-key';
import type { RegisterKind } from '@/lib/validation/registers';
import { QueryPrefill } from '../../query-prefill';

export async function RegistersPrefill({
  actor,
  projectId,
  kinds,
  children,
}: {
  actor: Actor;
  projectId: number;
  kinds: RegisterKind[];
  children: React.ReactNode;
}) {
  const lists = await listRegisters(actor, projectId, kinds);
  const entries = kinds.map((kind) => ({ key: registerQueryKey(projectId, kind), data: lists[kind] }));
  return <QueryPrefill entries={entries}>{children}</QueryPrefill>;
}

// The key a register's saved rows are cached under in the browser (TanStack Query), shared by
// the grids that read them and the pages that send them along with the page.
import type { RegisterKind } from '@/lib/validation/registers';

export function registerQueryKey(projectId: number, kind: RegisterKind) {
  return ['register', projectId, kind] as const;
}

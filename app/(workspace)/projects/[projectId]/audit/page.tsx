import Link from 'next/link';
import { loadProjectPage } from '../project-page';
import { listAudit } from '@/lib/services/registers/read';
import { AuditTrail } from '@/components/projects/audit-trail';

export const metadata = { title: 'Audit trail' };

export default async function AuditPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<{ before?: string }>;
}) {
  const { actor, project } = await loadProjectPage(params, 'audit');
  const before = Number((await searchParams).before) || undefined;
  const { entries, next } = await listAudit(actor, project.id, { before, limit: 100 });
  return (
    <div className="space-y-3">
      <AuditTrail entries={entries} />
      <div className="flex gap-3 text-sm">
        {before ? (
          <Link href={`/projects/${project.id}/audit`} className="text-cost hover:underline">
            Newest
          </Link>
        ) : null}
        {next ? (
          <Link href={`/projects/${project.id}/audit?before=${next}`} className="text-cost hover:underline">
            Older entries
          </Link>
        ) : null}
      </div>
    </div>
  );
}

import Link from 'next/link';

/** A link to one run's decision brief. */
export function BriefLink({
  projectId,
  runId,
  children,
}: {
  projectId: number;
  runId: number;
  children: React.ReactNode;
}) {
  return (
    <Link className="text-cost underline" href={`/projects/${projectId}/runs/${runId}/brief`}>
      {children}
    </Link>
  );
}

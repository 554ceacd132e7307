import type { BriefData } from '../build';

/** "RIV-02-run-14-brief.pdf": safe in a Content-Disposition header and on every file system. */
export function briefFileName(brief: Pick<BriefData, 'project' | 'run'>): string {
  const code = brief.project.code.replace(/[^A-Za-z0-9._-]/g, '-');
  return `${code}-run-${brief.run.id}-brief.pdf`;
}

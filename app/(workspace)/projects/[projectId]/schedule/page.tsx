import { latestCriticality } from '@/lib/services/runs';
import { loadProjectPage } from '../project-page';
import { ScheduleGrid } from '@/components/registers/schedule-grid';

export const metadata = { title: 'Schedule' };

export default async function SchedulePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project, readOnly } = await loadProjectPage(params, 'schedule');
  const latestRun = await latestCriticality(actor, project.id);
  return <ScheduleGrid projectId={project.id} readOnly={readOnly} latestRun={latestRun} />;
}

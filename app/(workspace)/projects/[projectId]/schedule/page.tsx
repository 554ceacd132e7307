import { latestCriticality } from '@/lib/services/runs';
import { loadProjectPage } from '../project-page';
import { RegistersPrefill } from '../registers-prefill';
import { ScheduleGrid } from '@/components/registers/schedule-grid';

export const metadata = { title: 'Schedule' };

export default async function SchedulePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project, readOnly } = await loadProjectPage(params, 'schedule');
  const latestRun = await latestCriticality(actor, project.id);
  return (
    <RegistersPrefill actor={actor} projectId={project.id} kinds={['activities']}>
      <ScheduleGrid projectId={project.id} readOnly={readOnly} latestRun={latestRun} />
    </RegistersPrefill>
  );
}

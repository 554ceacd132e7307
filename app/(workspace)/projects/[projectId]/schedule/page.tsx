import { loadProjectPage } from '../project-page';
import { ScheduleGrid } from '@/components/registers/schedule-grid';

export const metadata = { title: 'Schedule' };

export default async function SchedulePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { project, readOnly } = await loadProjectPage(params, 'schedule');
  return <ScheduleGrid projectId={project.id} readOnly={readOnly} />;
}

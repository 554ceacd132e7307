import { loadProjectPage } from '../project-page';
import { RegistersPrefill } from '../registers-prefill';
import { RiskEventsGrid } from '@/components/registers/risk-events-grid';

export const metadata = { title: 'Risk events' };

export default async function RiskEventsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project, readOnly } = await loadProjectPage(params, 'risks');
  return (
    <RegistersPrefill actor={actor} projectId={project.id} kinds={['risks', 'items', 'activities']}>
      <RiskEventsGrid projectId={project.id} currency={project.currency} readOnly={readOnly} />
    </RegistersPrefill>
  );
}

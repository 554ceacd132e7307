import { loadProjectPage } from '../project-page';
import { RegistersPrefill } from '../registers-prefill';
import { CorrelationsPanel } from '@/components/registers/correlations-panel';

export const metadata = { title: 'Correlations' };

export default async function CorrelationsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project, readOnly } = await loadProjectPage(params, 'correlations');
  return (
    <RegistersPrefill
      actor={actor}
      projectId={project.id}
      kinds={['correlations', 'items', 'risks', 'activities']}
    >
      <CorrelationsPanel projectId={project.id} readOnly={readOnly} />
    </RegistersPrefill>
  );
}

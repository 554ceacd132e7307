import { loadProjectPage } from '../project-page';
import { CorrelationsPanel } from '@/components/registers/correlations-panel';

export const metadata = { title: 'Correlations' };

export default async function CorrelationsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { project, readOnly } = await loadProjectPage(params, 'correlations');
  return <CorrelationsPanel projectId={project.id} readOnly={readOnly} />;
}

import { loadProjectPage } from '../project-page';
import { RiskEventsGrid } from '@/components/registers/risk-events-grid';

export const metadata = { title: 'Risk events' };

export default async function RiskEventsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { project, readOnly } = await loadProjectPage(params, 'risks');
  return <RiskEventsGrid projectId={project.id} currency={project.currency} readOnly={readOnly} />;
}

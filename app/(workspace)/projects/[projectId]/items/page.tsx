import { loadProjectPage } from '../project-page';
import { RegistersPrefill } from '../registers-prefill';
import { LineItemsGrid } from '@/components/registers/line-items-grid';

export const metadata = { title: 'Line items' };

export default async function LineItemsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { actor, project, readOnly } = await loadProjectPage(params, 'items');
  return (
    <RegistersPrefill actor={actor} projectId={project.id} kinds={['items', 'activities']}>
      <LineItemsGrid projectId={project.id} currency={project.currency} readOnly={readOnly} />
    </RegistersPrefill>
  );
}

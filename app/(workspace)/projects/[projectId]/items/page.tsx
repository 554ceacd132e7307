import { loadProjectPage } from '../project-page';
import { LineItemsGrid } from '@/components/registers/line-items-grid';

export const metadata = { title: 'Line items' };

export default async function LineItemsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { project, readOnly } = await loadProjectPage(params, 'items');
  return <LineItemsGrid projectId={project.id} currency={project.currency} readOnly={readOnly} />;
}

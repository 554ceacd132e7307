import { loadProjectPage } from '../project-page';
import { DriversGrid } from '@/components/registers/drivers-grid';

export const metadata = { title: 'Drivers' };

export default async function DriversPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { project, readOnly } = await loadProjectPage(params, 'drivers');
  return <DriversGrid projectId={project.id} currency={project.currency} readOnly={readOnly} />;
}

import { loadRunPage, type RunParams } from './run-page';

/**
 * Looks the run up before anything streams, so that another organisation's run, or one that
 * does not exist, answers with a real 404; the loading state sits below, in ./loading.tsx.
 */
export default async function RunLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: RunParams;
}) {
  await loadRunPage(params, '', 'run:read');
  return children;
}

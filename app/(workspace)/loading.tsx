import { Skeleton } from '@/components/ui/card';

export default function WorkspaceLoading() {
  return (
    <div className="max-w-3xl pt-4">
      <Skeleton rows={6} />
    </div>
  );
}

// The loading state of a workspace page. Each loading.tsx re-exports it, and they sit below the
// layouts that look a project or a run up: a loading state sent before that lookup would fix the
// response's status at 200, and another organisation's project would no longer answer 404.
import { Skeleton } from '@/components/ui/card';

export default function PageSkeleton() {
  return (
    <div className="max-w-3xl pt-4">
      <Skeleton rows={6} />
    </div>
  );
}

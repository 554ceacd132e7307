// What the registers → model export left out of a run's model or changed on its way in (closed
// risks and their correlations, occurred risks counted as certain), listed where runs are read
// and started.
import { Notice } from '@/components/ui/notice';

export function ModelNotices({ notices, title }: { notices: string[]; title: string }) {
  if (notices.length === 0) return null;
  return (
    <Notice tone="info" title={title}>
      <ul className="list-disc pl-5" data-testid="model-notices">
        {notices.map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
    </Notice>
  );
}

import { Notice } from '@/components/ui/notice';

/** The engine's warnings about this run, or a line saying there were none. */
export function WarningsList({ warnings }: { warnings: string[] }) {
  if (warnings.length === 0)
    return <p className="text-sm text-ink-soft">The engine raised no warnings for this run.</p>;
  return (
    <Notice
      tone="caution"
      title={`${warnings.length} warning${warnings.length > 1 ? 's' : ''} from the engine`}
    >
      <ul className="list-disc pl-5">
        {warnings.map((w, i) => (
          <li key={i}>{w}</li>
        ))}
      </ul>
    </Notice>
  );
}

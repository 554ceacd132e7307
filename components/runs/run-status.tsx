import type { RunStatus } from '@/lib/view-types/runs';

const LOOK: Record<RunStatus, { label: string; className: string }> = {
  queued: { label: 'Queued', className: 'border-rule-strong text-ink-soft' },
  running: { label: 'Running', className: 'border-cost text-cost' },
  succeeded: { label: 'Finished', className: 'border-cost/40 bg-cost-light text-cost-dark' },
  failed: { label: 'Failed', className: 'border-caution bg-caution-light text-caution-dark' },
  cancelled: { label: 'Cancelled', className: 'border-rule text-ink-faint' },
};

export function RunStatusBadge({ status }: { status: RunStatus }) {
  const look = LOOK[status];
  return (
    <span
      className={`inline-block rounded border px-1.5 py-px text-xs font-medium ${look.className}`}
      data-status={status}
    >
      {look.label}
    </span>
  );
}

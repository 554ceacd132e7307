'use client';

import { useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQuery } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { callApi, ApiError } from '@/components/forms/api';
import type { RunView } from '@/lib/view-types/runs';
import { formatCount, formatTimeLeft } from '@/lib/runs/format';
import { RunStatusBadge } from './run-status';

const ACTIVE = new Set(['queued', 'running']);

/**
 * A run that has not finished: its place in the queue or its progress bar, iterations done and
 * time left, polled twice a second; a cancel button. When the run succeeds the page reloads its
 * server part, which then shows the outcome.
 */
export function RunProgress({ initial, mayCancel }: { initial: RunView; mayCancel: boolean }) {
  const router = useRouter();
  const url = `/api/projects/${initial.projectId}/runs/${initial.id}`;
  const { data: run = initial, error } = useQuery({
    queryKey: ['run', initial.id],
    queryFn: async () => (await callApi<{ run: RunView }>(url)).run,
    initialData: initial,
    refetchInterval: (q) => (q.state.data && ACTIVE.has(q.state.data.status) ? 500 : false),
    staleTime: 0,
  });
  const [cancelling, setCancelling] = useState(false);
  const [cancelError, setCancelError] = useState<string | null>(null);
  const refreshed = useRef(false);

  useEffect(() => {
    if (run.status === 'succeeded' && !refreshed.current) {
      refreshed.current = true;
      router.refresh();
    }
  }, [run.status, router]);

  async function cancel() {
    setCancelling(true);
    setCancelError(null);
    try {
      await callApi(`${url}/cancel`, { method: 'POST', body: {} });
      router.refresh();
    } catch (e) {
      setCancelError(e instanceof ApiError ? e.message : 'The run could not be cancelled.');
    } finally {
      setCancelling(false);
    }
  }

  const pct = Math.round(run.progress * 1000) / 10;
  return (
    <div className="space-y-3 rounded border border-rule bg-paper-raised p-4" data-testid="run-progress">
      <div className="flex items-center gap-3">
        <RunStatusBadge status={run.status} />
        {run.status === 'queued' ? (
          <p className="text-sm" data-testid="queue-position">
            Waiting to start
            {run.queuePosition ? `: number ${run.queuePosition} in your organisation’s queue` : ''}. Two runs
            of an organisation go at once.
          </p>
        ) : null}
        {run.status === 'running' ? (
          <p className="num text-sm" data-testid="run-iterations">
            {formatCount(run.iterationsDone)} iterations done
            {run.settings.precision
              ? ` (up to ${formatCount(run.iterationsPlanned)})`
              : ` of ${formatCount(run.iterationsPlanned)}`}
            {' · '}time left {run.msLeft !== null ? formatTimeLeft(run.msLeft) : 'estimating…'}
          </p>
        ) : null}
        {run.status === 'succeeded' ? <p className="text-sm">Finished; loading the outcome…</p> : null}
        {mayCancel && ACTIVE.has(run.status) ? (
          <Button variant="danger" className="ml-auto" onClick={cancel} disabled={cancelling}>
            {cancelling ? 'Cancelling…' : 'Cancel run'}
          </Button>
        ) : null}
      </div>
      {ACTIVE.has(run.status) ? (
        <div
          role="progressbar"
          aria-label="Run progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          className="h-3 w-full overflow-hidden rounded bg-paper-sunk"
        >
          <div className="h-full bg-cost transition-[width] duration-300" style={{ width: `${pct}%` }} />
        </div>
      ) : null}
      {run.status === 'failed' ? (
        <Notice tone="caution" title="This run did not finish">
          {run.failureReason ?? 'The engine stopped without a reason.'}
        </Notice>
      ) : null}
      {run.status === 'cancelled' ? (
        <p className="text-sm text-ink-soft">
          This run was cancelled after {formatCount(run.iterationsDone)} iterations; nothing of it was kept.
        </p>
      ) : null}
      {error ? (
        <p className="text-sm text-caution-dark">Progress could not be read just now; retrying.</p>
      ) : null}
      {cancelError ? <p className="text-sm text-invalid">{cancelError}</p> : null}
    </div>
  );
}

'use client';

import { useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useQuery } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { callApi } from '@/components/forms/api';
import type { RunView } from '@/lib/view-types/runs';
import { formatDateTime, formatDays, formatMoney, formatPercent } from '@/lib/runs/format';
import { RunStatusBadge } from './run-status';
import { settingsText } from './settings-text';
import { TableHead, type HeadCell } from '@/components/ui/table';

const HEAD: HeadCell[] = [
  { title: <span className="sr-only">Compare</span>, padding: 'w-8 px-2 py-2' },
  ...['Run', 'Status', 'Started', 'By', 'Settings'],
  ...['Cost P50', 'Cost P80', 'Duration P80'].map((title) => ({ title, align: 'right' as const })),
  'Brief',
];

/** The project's runs, newest first; refreshed every second while one is queued or running. */
export function RunsHistory({
  projectId,
  currency,
  initial,
  mayStart,
}: {
  projectId: number;
  currency: string;
  initial: RunView[];
  mayStart: boolean;
}) {
  const router = useRouter();
  const { data: runs = initial } = useQuery({
    queryKey: ['runs', projectId],
    queryFn: async () => (await callApi<{ runs: RunView[] }>(`/api/projects/${projectId}/runs`)).runs,
    initialData: initial,
    refetchInterval: (q) =>
      q.state.data?.some((r) => r.status === 'queued' || r.status === 'running') ? 1000 : false,
  });
  const [picked, setPicked] = useState<number[]>([]);

  if (runs.length === 0) {
    return (
      <EmptyState title="No runs yet">
        {mayStart
          ? 'Choose the settings above and start the first run; its outcome will be listed here.'
          : 'An estimator or owner starts the runs of this project; they will be listed here.'}
      </EmptyState>
    );
  }
  const toggle = (id: number) =>
    setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : [...p.slice(-1), id]));
  const [older, newer] = [...picked].sort((a, b) => a - b);

  return (
    <div className="space-y-2">
      <div className="flex items-center gap-3">
        <p className="text-sm text-ink-soft">Tick two finished runs to compare them.</p>
        <Button
          variant="secondary"
          disabled={picked.length !== 2}
          onClick={() => router.push(`/projects/${projectId}/runs/compare?a=${older}&b=${newer}`)}
        >
          Compare selected
        </Button>
      </div>
      <table
        className="w-full border-collapse rounded border border-rule bg-paper-raised text-sm"
        data-testid="runs-table"
      >
        <TableHead look="banded" cells={HEAD} />
        <tbody>
          {runs.map((r) => (
            <tr key={r.id} className="border-t border-rule hover:bg-paper" data-run-id={r.id}>
              <td className="px-2 py-1.5">
                <input
                  type="checkbox"
                  aria-label={`Compare run ${r.number}`}
                  disabled={r.status !== 'succeeded'}
                  checked={picked.includes(r.id)}
                  onChange={() => toggle(r.id)}
                />
              </td>
              <td className="px-3 py-1.5 font-medium">
                <Link href={`/projects/${projectId}/runs/${r.id}`} className="text-cost hover:underline">
                  Run {r.number}
                </Link>
              </td>
              <td className="px-3 py-1.5">
                <RunStatusBadge status={r.status} />
                {r.status === 'running' ? (
                  <span className="num ml-2 text-xs text-ink-soft">{formatPercent(r.progress, 0)}</span>
                ) : null}
                {r.status === 'queued' && r.queuePosition ? (
                  <span className="ml-2 text-xs text-ink-soft">#{r.queuePosition} in queue</span>
                ) : null}
              </td>
              <td className="num px-3 py-1.5 text-left">{formatDateTime(r.createdAt)}</td>
              <td className="px-3 py-1.5">{r.startedBy?.name ?? '—'}</td>
              <td className="px-3 py-1.5 text-xs text-ink-soft">{settingsText(r.settings)}</td>
              <td className="num px-3 py-1.5">
                {r.summary ? formatMoney(r.summary.cost.P50, currency) : '—'}
              </td>
              <td className="num px-3 py-1.5 font-semibold">
                {r.summary ? formatMoney(r.summary.cost.P80, currency) : '—'}
              </td>
              <td className="num px-3 py-1.5">
                {r.summary?.duration ? formatDays(r.summary.duration.P80) : '—'}
              </td>
              <td className="px-3 py-1.5">
                {r.status === 'succeeded' ? (
                  <Link
                    href={`/projects/${projectId}/runs/${r.id}/brief`}
                    className="text-cost hover:underline"
                    aria-label={`Brief of run ${r.id}`}
                  >
                    Brief
                  </Link>
                ) : (
                  <span className="text-ink-faint">—</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

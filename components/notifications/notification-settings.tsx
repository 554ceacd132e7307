'use client';

import { useState } from 'react';
import { useMutation } from '@tanstack/react-query';
import type { NotificationPreferenceView } from '@/lib/view-types/notifications';
import { ApiError, callApi } from '@/components/forms/api';
import { Card, EmptyState } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

type Reply = { preferences: NotificationPreferenceView[] };

/** One switch per notice; each change is saved at once and said so. */
export function NotificationSettings({ initial }: { initial: NotificationPreferenceView[] }) {
  const [preferences, setPreferences] = useState(initial);
  const [status, setStatus] = useState<{ tone: 'success' | 'invalid'; text: string } | null>(null);
  const save = useMutation({
    mutationFn: (change: { kind: string; enabled: boolean }) =>
      callApi<Reply>('/api/notifications', { method: 'PUT', body: change }),
    onMutate: (change) => {
      setStatus(null);
      setPreferences((list) =>
        list.map((p) => (p.kind === change.kind ? { ...p, enabled: change.enabled } : p)),
      );
    },
    onSuccess: (reply, change) => {
      setPreferences(reply.preferences);
      const title = reply.preferences.find((p) => p.kind === change.kind)?.title ?? 'Notice';
      setStatus({ tone: 'success', text: `Saved: “${title}” is ${change.enabled ? 'on' : 'off'}.` });
    },
    onError: (e, change) => {
      // Put the switch back: the server kept the previous choice.
      setPreferences((list) =>
        list.map((p) => (p.kind === change.kind ? { ...p, enabled: !change.enabled } : p)),
      );
      setStatus({
        tone: 'invalid',
        text:
          e instanceof ApiError ? e.failure.message : 'The server could not be reached. Nothing was changed.',
      });
    },
  });

  if (!preferences.length) {
    return (
      <EmptyState title="No notices for your role">
        Your role does not take part in runs or decisions, so Outturn sends you only the e-mails you ask for.
      </EmptyState>
    );
  }

  return (
    <Card title="Notices">
      <ul className="divide-y divide-rule">
        {preferences.map((p) => {
          const id = `notice-${p.kind}`;
          return (
            <li key={p.kind} className="flex items-start gap-3 py-3 first:pt-0 last:pb-0">
              <input
                id={id}
                type="checkbox"
                role="switch"
                aria-checked={p.enabled}
                aria-describedby={`${id}-description`}
                className="mt-1 h-4 w-4 accent-cost"
                checked={p.enabled}
                disabled={save.isPending && save.variables?.kind === p.kind}
                onChange={(e) => save.mutate({ kind: p.kind, enabled: e.target.checked })}
              />
              <div className="min-w-0 flex-1">
                <label htmlFor={id} className="font-medium">
                  {p.title}
                </label>
                <p id={`${id}-description`} className="text-sm text-ink-soft">
                  {p.description}
                </p>
              </div>
              <span
                className={`text-xs ${p.enabled ? 'text-cost-dark' : 'text-ink-faint'}`}
                aria-hidden="true"
              >
                {p.enabled ? 'On' : 'Off'}
              </span>
            </li>
          );
        })}
      </ul>
      <div className="mt-3 min-h-[2.25rem]" aria-live="polite">
        {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
      </div>
    </Card>
  );
}

'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from '@/components/forms/api';

/** For estimators: e-mails the organisation's sponsors that this brief awaits their decision. */
export function SendToSponsors({
  projectId,
  runId,
  sentText,
}: {
  projectId: number;
  runId: number;
  sentText: string | null;
}) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'invalid'; text: string } | null>(null);

  async function send() {
    setBusy(true);
    setMessage(null);
    try {
      const { sponsors } = await callApi<{ sponsors: number }>(
        `/api/projects/${projectId}/brief/${runId}/send`,
        {
          method: 'POST',
          body: {},
        },
      );
      setMessage({ tone: 'success', text: `Sent to ${sponsors} sponsor${sponsors === 1 ? '' : 's'}.` });
      router.refresh();
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      setMessage({ tone: 'invalid', text: err.failure.message });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-2">
      <Button onClick={send} disabled={busy}>
        {busy ? 'Sending…' : sentText ? 'Send to sponsors again' : 'Send to sponsors for a decision'}
      </Button>
      {sentText ? <p className="text-xs text-ink-faint">{sentText}</p> : null}
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
    </div>
  );
}

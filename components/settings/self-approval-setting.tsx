'use client';

import { useState } from 'react';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { callApi } from '@/components/forms/api';
import { saveFailure } from './save-failure';
import type { OrganizationSettings } from '@/lib/view-types/organization';

/**
 * The owner's switch for self-approval. Off by default: a baseline is a funding decision, and a
 * second person checking the run is the usual control. A small organisation may have nobody else.
 */
export function SelfApprovalSetting({ initial }: { initial: OrganizationSettings }) {
  const [allowed, setAllowed] = useState(initial.allowSelfApproval);
  const [busy, setBusy] = useState(false);
  const [status, setStatus] = useState<{ tone: 'success' | 'invalid'; text: string } | null>(null);

  async function change(next: boolean) {
    // The switch moves at once and moves back if the server keeps the previous choice.
    setAllowed(next);
    setBusy(true);
    setStatus(null);
    try {
      const reply = await callApi<{ organization: OrganizationSettings }>('/api/organization', {
        method: 'PUT',
        body: { allowSelfApproval: next },
      });
      setAllowed(reply.organization.allowSelfApproval);
      setStatus({
        tone: 'success',
        text: next
          ? 'Saved: the person who started a run may now approve it; such decisions are marked self-approved.'
          : 'Saved: a run is approved by someone other than the person who started it.',
      });
    } catch (e) {
      setAllowed(!next);
      setStatus(saveFailure(e));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Card title="Approving baselines">
      <div className="space-y-3 text-sm">
        <p className="text-ink-soft">
          By default the person who started a run cannot also approve it as the baseline: a second person
          checks the inputs and the figures before money is committed (separation of duties).
        </p>
        <label className="flex items-start gap-3" htmlFor="allow-self-approval">
          <input
            id="allow-self-approval"
            type="checkbox"
            className="mt-1"
            checked={allowed}
            disabled={busy}
            onChange={(e) => change(e.target.checked)}
          />
          <span>
            <strong>Allow self-approval</strong>
            <span className="block text-xs text-ink-faint">
              For a small organisation where the same owner prepares and approves the analysis. Each such
              decision is marked “self-approved” on its brief and in the trend.
            </span>
          </span>
        </label>
        {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
      </div>
    </Card>
  );
}

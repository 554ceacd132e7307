'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Field, TextInput } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { callApi } from '@/components/forms/api';
import { saveFailure } from './save-failure';
import {
  DEFAULT_JOINT_CONFIDENCE,
  MAX_JOINT_CONFIDENCE,
  MIN_JOINT_CONFIDENCE,
  jointConfidenceSchema,
} from '@/lib/validation/organization';
import type { OrganizationSettings } from '@/lib/view-types/organization';

/**
 * The owner's choice of joint confidence: the chance of meeting both a cost and a finish date at
 * which each new run draws its frontier of cost and finish pairs. Runs already made keep theirs.
 */
export function JointConfidenceSetting({ initial }: { initial: OrganizationSettings }) {
  const [saved, setSaved] = useState(initial.jointConfidence);
  const [text, setText] = useState(String(initial.jointConfidence));
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [status, setStatus] = useState<{ tone: 'success' | 'invalid'; text: string } | null>(null);

  async function save(event: FormEvent) {
    event.preventDefault();
    setStatus(null);
    const checked = jointConfidenceSchema.safeParse(text.trim() === '' ? NaN : Number(text));
    if (!checked.success) {
      setError(checked.error.issues[0].message);
      return;
    }
    setError(null);
    setBusy(true);
    try {
      const reply = await callApi<{ organization: OrganizationSettings }>('/api/organization', {
        method: 'PUT',
        body: { jointConfidence: checked.data },
      });
      setSaved(reply.organization.jointConfidence);
      setText(String(reply.organization.jointConfidence));
      setStatus({
        tone: 'success',
        text: `Saved: runs started from now on draw their frontier at ${reply.organization.jointConfidence} % joint confidence. Runs already made keep theirs.`,
      });
    } catch (e) {
      setStatus(saveFailure(e));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Card title="Joint confidence of cost and finish">
      <form className="space-y-3 text-sm" onSubmit={save} noValidate aria-label="Joint confidence">
        <p className="text-ink-soft">
          The outcome of each run draws the pairs of cost and finish date that are met together with this
          chance (the frontier), and marks the targets against them. {DEFAULT_JOINT_CONFIDENCE} % unless you
          choose otherwise; your organisation&rsquo;s funding policy may set the level.
        </p>
        <div className="max-w-xs">
          <Field
            id="joint-confidence"
            label="Joint confidence (%)"
            error={error ?? undefined}
            hint={`A whole percent from ${MIN_JOINT_CONFIDENCE} to ${MAX_JOINT_CONFIDENCE}`}
          >
            <div className="flex gap-1.5">
              <TextInput
                id="joint-confidence"
                type="number"
                min={MIN_JOINT_CONFIDENCE}
                max={MAX_JOINT_CONFIDENCE}
                step={1}
                value={text}
                invalid={!!error}
                aria-describedby={error ? 'joint-confidence-error' : undefined}
                onChange={(e) => setText(e.target.value)}
              />
              <Button type="submit" disabled={busy || text === String(saved)}>
                {busy ? 'Saving…' : 'Save'}
              </Button>
            </div>
          </Field>
        </div>
        {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
      </form>
    </Card>
  );
}

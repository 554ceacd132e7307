'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from '@/components/forms/api';

type Choice = 'approved' | 'returned';

const CHOICES: { value: Choice; title: string; detail: (levelText: string) => string }[] = [
  {
    value: 'approved',
    title: 'Approve as the baseline',
    detail: (levelText) => `Funds the project at ${levelText}; the trend records it.`,
  },
  {
    value: 'returned',
    title: 'Return for rework',
    detail: () => 'The project keeps its current baseline.',
  },
];

/** A sponsor's decision on the run: approve it as the baseline, or return it with a reason. */
export function DecisionPanel({
  projectId,
  runId,
  levelText,
  approveRefusal = null,
  selfApproval = false,
}: {
  projectId: number;
  runId: number;
  levelText: string;
  /** Why this person may not approve the run (they started it); null when they may. */
  approveRefusal?: string | null;
  /** This person started the run and the organisation allows self-approval. */
  selfApproval?: boolean;
}) {
  const router = useRouter();
  const [choice, setChoice] = useState<Choice>(approveRefusal ? 'returned' : 'approved');
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [commentError, setCommentError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setError(null);
    setCommentError(null);
    if (choice === 'returned' && !comment.trim()) {
      setCommentError('Say why the run is returned, so that it can be reworked.');
      return;
    }
    setBusy(true);
    try {
      await callApi(`/api/projects/${projectId}/decisions`, { body: { runId, decision: choice, comment } });
      router.refresh();
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      const issue = err.failure.issues.find((i) => i.path === 'comment');
      if (issue) setCommentError(issue.message);
      else setError(err.failure.message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Decision on this run" noValidate>
      {error ? <Notice tone="invalid">{error}</Notice> : null}
      {approveRefusal ? (
        <Notice tone="caution" title="Someone else approves this run">
          <span data-testid="self-approval-refused">{approveRefusal}</span>
        </Notice>
      ) : null}
      {selfApproval ? (
        <p className="text-xs text-caution-dark" data-testid="self-approval-note">
          You started this run. Your organisation allows self-approval, so you may approve it; the decision
          will be marked self-approved on the brief and in the trend.
        </p>
      ) : null}
      <fieldset className="space-y-1.5">
        <legend className="text-sm font-medium text-ink-soft">Your decision</legend>
        {CHOICES.map((c) => (
          <label key={c.value} className="flex items-start gap-2 text-sm">
            <input
              type="radio"
              name="decision"
              value={c.value}
              checked={choice === c.value}
              disabled={c.value === 'approved' && approveRefusal !== null}
              onChange={() => setChoice(c.value)}
              className="mt-1"
            />
            <span>
              <strong>{c.title}</strong>
              <span className="block text-xs text-ink-faint">{c.detail(levelText)}</span>
            </span>
          </label>
        ))}
      </fieldset>
      <Field
        id="decision-comment"
        label={choice === 'returned' ? 'Reason (required)' : 'Comment (optional)'}
        error={commentError ?? undefined}
        hint="Recorded with your name and the time; a decision cannot be changed afterwards."
      >
        <textarea
          id="decision-comment"
          value={comment}
          onChange={(e) => setComment(e.target.value)}
          rows={3}
          maxLength={4000}
          aria-invalid={commentError ? true : undefined}
          className={`w-full rounded border bg-paper-raised px-2.5 py-1.5 text-base focus:border-cost focus:outline-none ${commentError ? 'border-invalid' : 'border-rule-strong'}`}
        />
      </Field>
      <Button type="submit" disabled={busy}>
        {busy ? 'Recording…' : choice === 'approved' ? 'Approve this baseline' : 'Return this run'}
      </Button>
    </form>
  );
}

'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from '@/components/forms/api';

const MAX = 8000;
type Notes = { assumptions: string | null; exclusions: string | null; version: number };

/** Edits the project's assumptions and exclusions that every brief prints. */
export function NotesEditor({ projectId, initial }: { projectId: number; initial: Notes }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [assumptions, setAssumptions] = useState(initial.assumptions ?? '');
  const [exclusions, setExclusions] = useState(initial.exclusions ?? '');
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [busy, setBusy] = useState(false);

  if (!open)
    return (
      <Button variant="secondary" onClick={() => setOpen(true)}>
        Edit assumptions and exclusions
      </Button>
    );

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setError(null);
    setSaved(false);
    try {
      await callApi(`/api/projects/${projectId}/notes`, {
        method: 'PUT',
        body: { assumptions, exclusions, version: initial.version },
      });
      setSaved(true);
      setOpen(false);
      router.refresh();
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      setError(err.failure.message);
    } finally {
      setBusy(false);
    }
  }

  const area = (id: string, label: string, value: string, set: (v: string) => void) => (
    <Field
      id={id}
      label={label}
      hint={`${value.length.toLocaleString('en-GB')} of ${MAX.toLocaleString('en-GB')} characters`}
    >
      <textarea
        id={id}
        value={value}
        onChange={(e) => set(e.target.value)}
        rows={5}
        maxLength={MAX}
        className="w-full rounded border border-rule-strong bg-paper-raised px-2.5 py-1.5 text-base focus:border-cost focus:outline-none"
      />
    </Field>
  );

  return (
    <form onSubmit={save} className="space-y-3" aria-label="Assumptions and exclusions">
      {error ? <Notice tone="invalid">{error}</Notice> : null}
      {saved ? <Notice tone="success">Saved.</Notice> : null}
      <div className="grid grid-cols-2 gap-3">
        {area('notes-assumptions', 'Assumptions', assumptions, setAssumptions)}
        {area('notes-exclusions', 'Exclusions', exclusions, setExclusions)}
      </div>
      <div className="flex gap-2">
        <Button type="submit" disabled={busy}>
          {busy ? 'Saving…' : 'Save'}
        </Button>
        <Button variant="ghost" onClick={() => setOpen(false)} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

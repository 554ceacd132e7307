'use client';
// Import a register from CSV/XLSX (preview, then commit in one transaction) and download it.
import { useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Button, buttonClass } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FILE_COLUMNS } from '@/lib/registers/columns';
import type { RegisterKind } from '@/lib/validation/registers';

type SheetPreview = {
  kind: RegisterKind;
  sheet: string;
  columns: { header: string; field: string | null }[];
  total: number;
  valid: number;
  invalid: number;
  creates: number;
  updates: number;
  rows: { line: number; values: Record<string, unknown>; issues: Record<string, string> }[];
};

const MAX_BYTES = 10 * 1024 * 1024;

async function post(projectId: number, file: File, register: string, mode: 'preview' | 'commit') {
  const form = new FormData();
  form.set('file', file);
  form.set('register', register);
  form.set('mode', mode);
  const response = await fetch(`/api/projects/${projectId}/import`, { method: 'POST', body: form });
  const json = await response.json().catch(() => null);
  if (!response.ok) throw new Error(json?.error?.message ?? `The server answered ${response.status}.`);
  return json;
}

export function ImportExport({
  projectId,
  register,
  readOnly,
}: {
  projectId: number;
  register: RegisterKind;
  readOnly: boolean;
}) {
  const [open, setOpen] = useState(false);
  const base = `/api/projects/${projectId}/export`;
  return (
    <>
      {readOnly ? null : (
        <Button variant="secondary" onClick={() => setOpen(true)}>
          Import…
        </Button>
      )}
      <a
        className={buttonClass('secondary')}
        href={`${base}?format=csv&register=${register}`}
        download
        title="Download this register as a CSV file"
      >
        Download CSV
      </a>
      <a
        className={buttonClass('secondary')}
        href={`${base}?format=xlsx&register=all`}
        download
        title="Download every register as one XLSX workbook"
      >
        Download XLSX
      </a>
      <a
        className={buttonClass('secondary')}
        href={`${base}?format=model`}
        download
        title="Download the whole project as a model file (JSON)"
      >
        Download model file
      </a>
      {open ? (
        <ImportDialog projectId={projectId} register={register} onClose={() => setOpen(false)} />
      ) : null}
    </>
  );
}

export function ImportDialog({
  projectId,
  register,
  onClose,
  onDone,
}: {
  projectId: number;
  register: RegisterKind | 'all';
  onClose: () => void;
  onDone?: () => void;
}) {
  const qc = useQueryClient();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<SheetPreview[] | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function choose(f: File | undefined) {
    setPreview(null);
    setError(null);
    setDone(null);
    if (!f) return;
    if (f.size > MAX_BYTES) {
      setError(`${f.name} is ${(f.size / 1048576).toFixed(1)} MB; files up to 10 MB are accepted.`);
      return;
    }
    setFile(f);
    if (f.name.toLowerCase().endsWith('.json')) return;
    setBusy('Reading the file…');
    try {
      setPreview((await post(projectId, f, register, 'preview')).sheets);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(null);
    }
  }

  async function commit() {
    if (!file) return;
    setBusy('Importing…');
    setError(null);
    try {
      const result = await post(projectId, file, register, 'commit');
      if (result.imported) {
        const i = result.imported;
        setDone(
          `Model imported: ${i.items} line items, ${i.risks} risks, ${i.activities} activities, ${i.drivers ?? 0} drivers, ${i.correlations} correlations.`,
        );
      } else {
        setDone(
          (result.sheets as { sheet: string; created: number; updated: number }[])
            .map((s) => `${s.sheet}: ${s.created} added, ${s.updated} updated`)
            .join('; '),
        );
      }
      await qc.invalidateQueries({ queryKey: ['register', projectId] });
      onDone?.();
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(null);
    }
  }

  const invalid = preview?.some((s) => s.invalid > 0);
  return (
    <div
      className="fixed inset-0 z-50 flex items-start justify-center bg-ink/30 p-8"
      role="dialog"
      aria-modal="true"
      aria-label="Import"
    >
      <div className="max-h-[85vh] w-full max-w-5xl overflow-auto rounded border border-rule bg-paper-raised p-4 shadow-lg">
        <div className="mb-3 flex items-center justify-between">
          <h2 className="text-lg font-semibold">
            Import {register === 'all' ? 'a workbook or model file' : 'from a file'}
          </h2>
          <Button variant="ghost" onClick={onClose}>
            Close
          </Button>
        </div>
        <p className="mb-2 text-sm text-ink-soft">
          A CSV or XLSX file with a header row (up to 10 MB and 20,000 rows), or a model file (.json), which
          replaces all registers. Rows update the line with the same code, or are added. Nothing is saved
          until you import.
        </p>
        <label className="mb-3 block text-sm font-medium" htmlFor="import-file">
          File
        </label>
        <input
          id="import-file"
          ref={input}
          type="file"
          accept=".csv,.xlsx,.json,text/csv"
          onChange={(e) => choose(e.target.files?.[0])}
          className="mb-3 block text-sm"
        />
        {busy ? (
          <p className="text-sm text-ink-soft" aria-live="polite">
            {busy}
          </p>
        ) : null}
        {error ? <Notice tone="invalid">{error}</Notice> : null}
        {done ? <Notice tone="success">{done}</Notice> : null}
        {file && file.name.toLowerCase().endsWith('.json') && !done ? (
          <Notice tone="caution">
            A model file replaces every register of the project (line items, risks, schedule, drivers,
            correlations).
          </Notice>
        ) : null}
        {preview?.map((s) => (
          <section key={s.sheet} className="mt-3 space-y-2" aria-label={`Preview of ${s.sheet}`}>
            <h3 className="font-semibold">
              {s.sheet}: {s.total} rows · {s.creates} new · {s.updates} update ·{' '}
              {s.invalid > 0 ? (
                <span className="text-invalid">{s.invalid} with problems</span>
              ) : (
                'no problems'
              )}
            </h3>
            <p className="text-xs text-ink-soft">
              Columns:{' '}
              {s.columns.map((c, i) => (
                <span key={i} className={c.field ? '' : 'text-ink-faint line-through'}>
                  {c.header}
                  {c.field
                    ? ` → ${FILE_COLUMNS[s.kind].find((f) => f.field === c.field)?.header}`
                    : ' (ignored)'}
                  {i < s.columns.length - 1 ? ', ' : ''}
                </span>
              ))}
            </p>
            <div className="max-h-72 overflow-auto border border-rule">
              <table className="w-full text-xs">
                <thead className="sticky top-0 bg-paper-sunk">
                  <tr>
                    <th className="px-2 py-1 text-left">Line</th>
                    {s.columns
                      .filter((c) => c.field)
                      .map((c) => (
                        <th key={c.field} className="px-2 py-1 text-left">
                          {c.header}
                        </th>
                      ))}
                    <th className="px-2 py-1 text-left">Problems</th>
                  </tr>
                </thead>
                <tbody>
                  {s.rows.map((r) => (
                    <tr key={r.line} className="border-t border-rule" data-testid={`preview-line-${r.line}`}>
                      <td className="num px-2 py-0.5">{r.line}</td>
                      {s.columns
                        .filter((c) => c.field)
                        .map((c) => (
                          <td
                            key={c.field}
                            className={`px-2 py-0.5 ${r.issues[c.field!] ? 'bg-invalid-light text-invalid' : ''}`}
                          >
                            {Array.isArray(r.values[c.field!])
                              ? (r.values[c.field!] as { code: string; lag: number }[])
                                  .map((p) => (p.lag ? `${p.code}${p.lag > 0 ? '+' : ''}${p.lag}` : p.code))
                                  .join(', ')
                              : String(r.values[c.field!] ?? '')}
                          </td>
                        ))}
                      <td className="px-2 py-0.5 text-invalid">
                        {Object.entries(r.issues)
                          .map(([f, m]) => `${f}: ${m}`)
                          .join(' · ')}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </section>
        ))}
        <div className="mt-3 flex gap-2">
          <Button onClick={commit} disabled={!file || Boolean(busy) || Boolean(invalid) || Boolean(done)}>
            {file?.name.toLowerCase().endsWith('.json')
              ? 'Replace the registers'
              : `Import ${preview ? preview.reduce((n, s) => n + s.total, 0) : ''} rows`}
          </Button>
          {invalid ? (
            <span className="self-center text-sm text-invalid">
              Fix the rows with problems in the file, then choose it again.
            </span>
          ) : null}
        </div>
      </div>
    </div>
  );
}

'use client';
// Correlations: pairs of inputs (searchable lists of the project's line items, risks,
// activities and drivers) with a coefficient; the engine's validity check runs on every change and shows
// the coefficients it would use when the set is not a valid correlation matrix.
import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { callApi } from '@/components/forms/api';
import { CorrelationHeatmap } from '@/components/charts/correlation-heatmap';
import {
  newKey,
  registerQueryKey,
  useRegisterRows,
  type SavedRow,
} from '@/components/grid/use-register-rows';
import { Button } from '@/components/ui/button';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { readNumber } from '@/lib/registers/numbers';
import { planCorrelations } from '@/lib/sim';
import { rowIssues } from '@/lib/validation/registers';
import { ImportExport } from './import-export';
import { RegisterNotice } from './register-notice';
import { TableHead } from '@/components/ui/table';
import { existenceInput } from '@/lib/sim';

type Input = { code: string; label: string; group: string };

function useInputs(projectId: number): Input[] {
  const fetch = (kind: 'items' | 'risks' | 'activities' | 'drivers') => ({
    queryKey: registerQueryKey(projectId, kind),
    queryFn: async () => (await callApi<{ rows: SavedRow[] }>(`/api/projects/${projectId}/${kind}`)).rows,
  });
  const items = useQuery(fetch('items'));
  const risks = useQuery(fetch('risks'));
  const activities = useQuery(fetch('activities'));
  const drivers = useQuery(fetch('drivers'));
  return useMemo(
    () => [
      ...(items.data ?? []).map((r) => ({
        code: String(r.code),
        label: String(r.description),
        group: 'Line item',
      })),
      ...(risks.data ?? []).map((r) => ({ code: String(r.code), label: String(r.title), group: 'Risk' })),
      ...(activities.data ?? []).map((r) => ({
        code: String(r.code),
        label: String(r.name),
        group: 'Activity',
      })),
      ...(drivers.data ?? []).map((r) => ({ code: String(r.code), label: String(r.name), group: 'Driver' })),
      // A branch's existence is correlated like a risk (whether it happens), by its own name.
      ...(activities.data ?? [])
        .filter((r) => typeof r.existence === 'number')
        .map((r) => ({
          code: existenceInput(String(r.code)),
          label: `whether ${String(r.name)} happens`,
          group: 'Branch',
        })),
    ],
    [items.data, risks.data, activities.data, drivers.data],
  );
}

/** The coefficients the engine would use: the targets, or the nearest valid matrix. */
export function checkCorrelations(pairs: { a: string; b: string; rho: number }[]) {
  const index = new Map<string, number>();
  const id = (c: string) => {
    if (!index.has(c)) index.set(c, index.size);
    return index.get(c)!;
  };
  const requests = pairs.map((p) => ({ a: id(p.a), b: id(p.b), rho: p.rho }));
  const codes = [...index.keys()];
  const plan = planCorrelations(requests, (v) => codes[v]);
  return { used: plan.used, warnings: plan.warnings, codes };
}

function InputPicker({
  id,
  label,
  value,
  onChange,
  inputs,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  inputs: Input[];
}) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        list={`${id}-list`}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        placeholder="Type a code or name"
        className="w-56 rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
        autoComplete="off"
      />
      <datalist id={`${id}-list`}>
        {inputs.map((i) => (
          <option key={i.code} value={i.code}>
            {`${i.group}: ${i.label}`}
          </option>
        ))}
      </datalist>
    </div>
  );
}

export function CorrelationsPanel({ projectId, readOnly }: { projectId: number; readOnly: boolean }) {
  const inputs = useInputs(projectId);
  const known = useMemo(() => new Map(inputs.map((i) => [i.code, i])), [inputs]);
  const register = useRegisterRows(projectId, 'correlations');
  const [a, setA] = useState('');
  const [b, setB] = useState('');
  const [rho, setRho] = useState('0.5');
  const [formError, setFormError] = useState<string | null>(null);
  const [edits, setEdits] = useState<Record<string, string>>({});

  const pairs = useMemo(
    () =>
      register.rows
        .filter((r) => typeof r.rho === 'number')
        .map((r) => ({ key: r._key, a: String(r.aCode), b: String(r.bCode), rho: r.rho as number })),
    [register.rows],
  );
  const check = useMemo(() => checkCorrelations(pairs), [pairs]);

  function add() {
    const values = { aCode: a.trim(), bCode: b.trim(), rho: readNumber(rho) };
    const issues = rowIssues('correlations', values);
    if (!known.has(values.aCode)) issues.aCode ??= `Unknown input "${values.aCode}": pick one from the list.`;
    if (!known.has(values.bCode)) issues.bCode ??= `Unknown input "${values.bCode}": pick one from the list.`;
    if (pairs.some((p) => [p.a, p.b].sort().join() === [values.aCode, values.bCode].sort().join())) {
      issues.bCode ??= `The pair ${values.aCode}–${values.bCode} is already listed; change its coefficient below.`;
    }
    const first = Object.values(issues)[0];
    if (first) {
      setFormError(first);
      return;
    }
    setFormError(null);
    register.applyValues([{ key: newKey(), values }]);
    setA('');
    setB('');
  }

  function saveRho(key: string) {
    const text = edits[key];
    if (text === undefined) return;
    const row = register.rows.find((r) => r._key === key);
    if (!row) return;
    register.applyValues([{ key, values: { aCode: row.aCode, bCode: row.bCode, rho: readNumber(text) } }]);
    setEdits(({ [key]: _, ...rest }) => rest);
  }

  if (register.query.isPending) return <Skeleton rows={6} />;
  if (register.query.isError)
    return (
      <Notice tone="invalid">The correlations could not be loaded: {register.query.error.message}</Notice>
    );

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        {readOnly ? (
          <span className="rounded border border-rule bg-paper-sunk px-2 py-1 text-xs text-ink-soft">
            Read only: your role can read and download this register.
          </span>
        ) : (
          <>
            <InputPicker id="corr-a" label="First input" value={a} onChange={setA} inputs={inputs} />
            <InputPicker id="corr-b" label="Second input" value={b} onChange={setB} inputs={inputs} />
            <div className="space-y-1">
              <label htmlFor="corr-rho" className="block text-sm font-medium text-ink-soft">
                Coefficient (−1 to 1)
              </label>
              <input
                id="corr-rho"
                value={rho}
                onChange={(e) => setRho(e.target.value)}
                onKeyDown={(e) => e.key === 'Enter' && add()}
                className="num w-24 rounded border border-rule-strong bg-paper-raised px-2 py-1 text-sm"
              />
            </div>
            <Button onClick={add}>Add pair</Button>
          </>
        )}
        <div className="ml-auto flex gap-2">
          <ImportExport projectId={projectId} register="correlations" readOnly={readOnly} />
        </div>
      </div>
      {formError ? <Notice tone="invalid">{formError}</Notice> : null}
      <RegisterNotice register={register} />
      {check.warnings.length ? (
        <Notice tone="caution" title="These coefficients do not form a valid correlation matrix">
          The engine will use the nearest valid matrix (Higham 2002); the “Used” column shows the coefficients
          it will use.
        </Notice>
      ) : pairs.length ? (
        <p className="text-xs text-ink-soft" role="status">
          The coefficients form a valid correlation matrix; the engine uses them as entered.
        </p>
      ) : null}
      <div className="grid grid-cols-[minmax(0,1fr)_auto] gap-4">
        {register.rows.length === 0 ? (
          <p className="text-ink-soft">
            No correlations yet. Pair two inputs that move together, such as two lines priced on the same
            rate.
          </p>
        ) : (
          <table className="w-full border-collapse text-sm" aria-label="Correlations">
            <TableHead
              look="compact"
              cells={[
                'First input',
                'Second input',
                { title: 'Coefficient', align: 'right' },
                { title: 'Used', align: 'right' },
                '',
              ]}
            />
            <tbody>
              {register.rows.map((r) => {
                const i = pairs.findIndex((p) => p.key === r._key);
                const used = i >= 0 ? check.used[i] : null;
                const moved = used !== null && Math.abs(used - (r.rho as number)) > 0.005;
                const name = (c: unknown) => known.get(String(c))?.label ?? 'unknown input';
                return (
                  <tr
                    key={r._key}
                    className="border-t border-rule"
                    data-testid={`corr-${r.aCode}-${r.bCode}`}
                  >
                    <td className="px-2 py-1">
                      <span className="font-medium">{String(r.aCode)}</span>{' '}
                      <span className="text-ink-faint">{name(r.aCode)}</span>
                    </td>
                    <td className="px-2 py-1">
                      <span className="font-medium">{String(r.bCode)}</span>{' '}
                      <span className="text-ink-faint">{name(r.bCode)}</span>
                    </td>
                    <td className="px-2 py-1 text-right">
                      {readOnly ? (
                        <span className="num">{Number(r.rho).toFixed(2)}</span>
                      ) : (
                        <input
                          aria-label={`Coefficient of ${r.aCode}–${r.bCode}`}
                          className={`num w-20 rounded border px-1 py-0.5 ${r._issues.rho ? 'border-invalid bg-invalid-light' : 'border-rule-strong'}`}
                          value={edits[r._key] ?? String(r.rho ?? '')}
                          title={r._issues.rho}
                          onChange={(e) => setEdits((s) => ({ ...s, [r._key]: e.target.value }))}
                          onBlur={() => saveRho(r._key)}
                          onKeyDown={(e) => e.key === 'Enter' && saveRho(r._key)}
                        />
                      )}
                      {r._issues.rho ? <p className="text-xs text-invalid">{r._issues.rho}</p> : null}
                    </td>
                    <td
                      className={`num px-2 py-1 ${moved ? 'font-semibold text-caution-dark' : 'text-ink-soft'}`}
                    >
                      {used === null ? '' : used.toFixed(2)}
                    </td>
                    <td className="px-2 py-1 text-right">
                      {readOnly ? null : (
                        <Button
                          variant="ghost"
                          onClick={() => register.deleteRows([r._key])}
                          aria-label={`Remove ${r.aCode}–${r.bCode}`}
                        >
                          Remove
                        </Button>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
        <CorrelationHeatmap codes={check.codes} pairs={pairs} />
      </div>
    </div>
  );
}

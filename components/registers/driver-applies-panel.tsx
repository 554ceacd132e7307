'use client';
// Beside the drivers grid: what the focused driver applies to, as a searchable pick list of the
// project's WBS branches, line items and activities, and the list of what it covers today.
// Ticking a branch stores it as typed ("3.*"), so lines added under it later join the driver.
import { useMemo, useState } from 'react';
import type { GridRow } from '@/components/grid/use-register-rows';
import { TextInput } from '@/components/ui/field';
import { inBranch, parseToken, resolveApplies, splitApplies } from '@/lib/registers/driver-applies';

export type Target = { code: string; label: string; group: 'item' | 'activity' };

type Option = { token: string; code: string; label: string; note: string; branch: boolean };

const MAX_SHOWN = 200;

/** Every WBS branch of the line items with more than one line under it: "3", "3.2"… */
function branchesOf(items: Target[]): { prefix: string; count: number }[] {
  const prefixes = new Set<string>();
  for (const t of items) {
    const parts = t.code.split('.');
    for (let n = 1; n < parts.length; n++) prefixes.add(parts.slice(0, n).join('.'));
  }
  return [...prefixes]
    .map((prefix) => ({ prefix, count: items.filter((t) => inBranch(t.code, prefix)).length }))
    .filter((b) => b.count > 1)
    .sort((a, b) => a.prefix.localeCompare(b.prefix, 'en', { numeric: true }));
}

type Props = {
  row: GridRow | null;
  targets: Target[];
  readOnly: boolean;
  onChange: (applies: string[]) => void;
};

export function DriverAppliesPanel({ row, targets, readOnly, onChange }: Props) {
  const [query, setQuery] = useState('');
  const items = useMemo(() => targets.filter((t) => t.group === 'item'), [targets]);
  const options = useMemo<Option[]>(() => {
    const byCode = new Map(items.map((t) => [t.code, t.label]));
    return [
      ...branchesOf(items).map((b) => ({
        token: `${b.prefix}.*`,
        code: `All of ${b.prefix}.x`,
        label: byCode.get(b.prefix) ?? '',
        note: `${b.count} lines`,
        branch: true,
      })),
      ...targets.map((t) => ({
        token: t.code,
        code: t.code,
        label: t.label,
        note: t.group === 'item' ? 'line' : 'activity',
        branch: false,
      })),
    ];
  }, [items, targets]);

  const typed = useMemo(() => (row ? splitApplies(row.applies) : []), [row]);
  const resolved = useMemo(
    () =>
      resolveApplies(typed, {
        items: items.map((t) => t.code),
        activities: targets.filter((t) => t.group === 'activity').map((t) => t.code),
      }),
    [typed, items, targets],
  );
  const branches = typed.map(parseToken).filter((t) => t.kind === 'branch');
  const q = query.trim().toLowerCase();
  const shown = options.filter(
    (o) =>
      !q || o.code.toLowerCase().includes(q) || o.label.toLowerCase().includes(q) || o.token.startsWith(q),
  );
  const labelOf = new Map(targets.map((t) => [t.code, t.label]));

  if (!row)
    return (
      <aside
        className="w-72 rounded border border-rule bg-paper-raised p-3 text-sm text-ink-soft"
        aria-label="Applies to"
      >
        <h2 className="mb-1 font-semibold text-ink">Applies to</h2>
        <p>Select a driver&rsquo;s row to pick the line items, activities and WBS branches it scales.</p>
        <p className="mt-2">
          A driver multiplies the sampled cost of its line items and the sampled duration of its activities by
          one factor in each iteration where it acts. It is not part of the base estimate.
        </p>
      </aside>
    );

  const toggle = (token: string, on: boolean) =>
    onChange(on ? [...typed, token] : typed.filter((t) => t !== token));

  return (
    <aside
      className="flex w-72 flex-col gap-2 rounded border border-rule bg-paper-raised p-3 text-sm"
      aria-label="Applies to"
      data-testid="driver-applies"
    >
      <div>
        <h2 className="font-semibold">Applies to</h2>
        <p className="truncate text-ink-soft">
          {String(row.code ?? '')} {String(row.name ?? '')}
        </p>
        {row.standsFor ? (
          <p className="mt-1 line-clamp-3 text-xs text-ink-soft" title={String(row.standsFor)}>
            {String(row.standsFor)}
          </p>
        ) : null}
      </div>
      <TextInput
        type="search"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        placeholder="Search codes, names, 3.*"
        aria-label="Search WBS branches, line items and activities"
      />
      <ul
        className="max-h-64 overflow-auto rounded border border-rule"
        aria-label="Branches, line items and activities"
      >
        {shown.slice(0, MAX_SHOWN).map((o) => {
          const checked = typed.includes(o.token);
          const viaBranch =
            !checked && !o.branch
              ? branches.find((b) => b.kind === 'branch' && inBranch(o.token, b.prefix))
              : undefined;
          return (
            <li key={`${o.branch ? 'b' : 'c'}${o.token}`} className="border-b border-rule last:border-b-0">
              <label className="flex cursor-pointer items-baseline gap-2 px-2 py-1 hover:bg-paper-sunk">
                <input
                  type="checkbox"
                  checked={checked || Boolean(viaBranch)}
                  disabled={readOnly || Boolean(viaBranch)}
                  onChange={(e) => toggle(o.token, e.target.checked)}
                />
                <span className={o.branch ? 'font-semibold' : 'font-medium'}>{o.code}</span>
                <span className="min-w-0 flex-1 truncate text-ink-soft">{o.label}</span>
                <span className="text-xs text-ink-faint">{viaBranch ? `in ${viaBranch.text}` : o.note}</span>
              </label>
            </li>
          );
        })}
        {shown.length === 0 ? (
          <li className="px-2 py-1 text-ink-soft">Nothing matches &ldquo;{query}&rdquo;.</li>
        ) : null}
        {shown.length > MAX_SHOWN ? (
          <li className="px-2 py-1 text-ink-faint">{shown.length - MAX_SHOWN} more: narrow the search.</li>
        ) : null}
      </ul>
      {resolved.problems.length ? (
        <ul className="text-xs text-invalid" role="alert">
          {resolved.problems.map((p) => (
            <li key={p.token}>{p.message}</li>
          ))}
        </ul>
      ) : null}
      <div>
        <h3 className="font-semibold" id="driver-covers">
          Covers now: {resolved.codes.length}
        </h3>
        {resolved.codes.length ? (
          <ul
            className="max-h-40 overflow-auto text-xs"
            aria-labelledby="driver-covers"
            data-testid="driver-covers"
          >
            {resolved.codes.map((c) => (
              <li key={c} className="flex gap-2">
                <span className="font-medium tabular-nums">{c}</span>
                <span className="truncate text-ink-soft">{labelOf.get(c)}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-xs text-ink-soft">Nothing yet: tick a branch, a line item or an activity.</p>
        )}
      </div>
    </aside>
  );
}

'use client';
// The drivers register: conditions (ground, market, design maturity…) that scale many line
// items and activities at once by one sampled factor. The range is typed as percentage changes
// or as factors (the row's "Entered as") and shown both ways; what a driver applies to is typed
// as codes and WBS branches ("3.*"), picked in the panel beside the grid, which lists what the
// list covers today.
import { useCallback, useMemo, useState } from 'react';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { DIST_LABELS } from '@/lib/registers/dist-fields';
import { describeResolution, resolveApplies, splitApplies } from '@/lib/registers/driver-applies';
import {
  formatChange,
  formatFactor,
  formatRange,
  readFactor,
  type FactorEntry,
} from '@/lib/registers/driver-factor';
import { DRIVER_FACTOR_TYPES } from '@/lib/validation/registers';
import { distColumns } from './dist-columns';
import { DriverAppliesPanel, type Target } from './driver-applies-panel';
import { RegisterTab, type RegisterTabProps } from './register-tab';
import { duplicateCodeIssue, useRegisterPage, useSavedRows } from './use-register-page';

const FACTOR_FIELDS = ['low', 'mode', 'high'] as const;

/** Whether low and high are bounds or P10 and P90: the column every distribution uses. */
const RANGE_COLUMN = distColumns().find((c) => c.field === 'range')!;

const entryOf = (row: Record<string, unknown>): FactorEntry => (row.entry === 'factor' ? 'factor' : 'change');

/** Whether a factor cell takes a value under the row's distribution. */
const hasPart = (part: (typeof FACTOR_FIELDS)[number]) => (r: GridRow) => {
  const type = r.distType as string | null;
  if (!type) return false;
  if (type === 'fixed') return part === 'mode';
  if (type === 'uniform' || type === 'lognormal') return part !== 'mode';
  return true;
};

/** A factor cell shown as the row states it: "−5%" or "0.95"; typed text as it was typed. */
const showFactor = (v: unknown, row: GridRow) =>
  typeof v === 'number'
    ? entryOf(row) === 'change'
      ? formatChange(v)
      : formatFactor(v)
    : v
      ? String(v)
      : '';

/** The range's ends (the value alone for a fixed factor), for the two range columns. */
const rangeOf = (row: GridRow) =>
  (row.distType === 'fixed' ? ['mode'] : ['low', 'high']).map((f) => row[f] as number | null);

export function DriversGrid({ projectId, readOnly }: RegisterTabProps) {
  const items = useSavedRows(projectId, 'items');
  const activities = useSavedRows(projectId, 'activities');
  const targets = useMemo(
    () => ({
      items: (items.data ?? []).map((r) => String(r.code)),
      activities: (activities.data ?? []).map((r) => String(r.code)),
    }),
    [items.data, activities.data],
  );
  const loaded = Boolean(items.data && activities.data);

  const extraIssues = useCallback(
    (v: Record<string, unknown>, all: Record<string, unknown>[]) => {
      const out: Record<string, string> = {};
      const duplicate = duplicateCodeIssue(v, all, 'driver');
      if (duplicate) out.code = duplicate;
      if (loaded) {
        const { problems } = resolveApplies(splitApplies(v.applies), targets);
        if (problems.length) out.applies = problems.map((p) => p.message).join(' ');
      }
      return out;
    },
    [loaded, targets],
  );
  const blank = useCallback(
    () => ({
      code: '',
      name: '',
      probability: 1,
      distType: 'triangular',
      range: 'min-max',
      entry: 'change',
      applies: [],
    }),
    [],
  );
  const base = useRegisterPage(projectId, 'drivers', blank, extraIssues);
  const [focusKey, setFocusKey] = useState<string | null>(null);

  // Typed factor cells become factors here, read in the row's own way ("-5" is −5% in a row
  // entered as changes, a factor of −5 in one entered as factors, which the schema refuses).
  const { register } = base;
  const applyValues = register.applyValues;
  const page = useMemo(() => {
    const byKey = new Map(register.rows.map((r) => [r._key, r]));
    const convert: typeof applyValues = (updates, options) =>
      applyValues(
        updates.map((u) => {
          const entry = entryOf({ ...(byKey.get(u.key) ?? {}), ...u.values });
          const values = { ...u.values };
          for (const f of FACTOR_FIELDS) if (f in values) values[f] = readFactor(values[f], entry);
          return { ...u, values };
        }),
        options,
      );
    return {
      ...base,
      register: { ...register, applyValues: convert },
      onFocusRow: (key: string | null) => {
        setFocusKey(key);
        return base.onFocusRow(key);
      },
    };
  }, [base, register, applyValues]);

  const columns = useMemo<RegisterColumn[]>(
    () => [
      { field: 'code', header: 'Code', kind: 'text', width: 80, pinned: 'left' },
      { field: 'name', header: 'Driver', kind: 'text', width: 180, pinned: 'left' },
      { field: 'probability', header: 'Probability', kind: 'percent', width: 96 },
      {
        field: 'applies',
        header: 'Applies to',
        kind: 'text',
        width: 170,
        format: (v) => splitApplies(v).join(', '),
        headerTooltip:
          'Codes of line items and activities, and WBS branches: 3.* (or "all of 3.x") is 3 and every line below it',
      },
      {
        field: '_covers',
        header: 'Covers now',
        kind: 'computed',
        width: 150,
        value: (r) =>
          loaded ? describeResolution(resolveApplies(splitApplies(r.applies), targets).codes, targets) : '',
      },
      {
        field: 'distType',
        header: 'Distribution',
        kind: 'choice',
        width: 106,
        options: DRIVER_FACTOR_TYPES.map((t) => ({ value: t, label: DIST_LABELS[t] })),
      },
      RANGE_COLUMN,
      {
        field: 'entry',
        header: 'Entered as',
        kind: 'choice',
        width: 96,
        options: [
          { value: 'change', label: '% change' },
          { value: 'factor', label: 'Factor' },
        ],
        headerTooltip: 'Type the range as percentage changes (−5%, +20%) or as factors (0.95, 1.20)',
      },
      ...FACTOR_FIELDS.map<RegisterColumn>((f, i) => ({
        field: f,
        header: ['Low', 'Most likely', 'High'][i],
        kind: 'text',
        width: 88,
        applies: hasPart(f),
        format: showFactor,
        headerTooltip: 'A change such as −5% or +20%, or a factor such as 0.95 or 1.20',
      })),
      {
        field: '_change',
        header: 'Range as change',
        kind: 'computed',
        width: 126,
        value: (r) => formatRange(rangeOf(r), 'change'),
      },
      {
        field: '_factor',
        header: 'Range as factor',
        kind: 'computed',
        width: 120,
        value: (r) => formatRange(rangeOf(r), 'factor'),
      },
      { field: 'standsFor', header: 'What it stands for', kind: 'text', width: 260 },
    ],
    [loaded, targets],
  );

  const options = useMemo<Target[]>(
    () => [
      ...(items.data ?? []).map((r) => ({
        code: String(r.code),
        label: String(r.description),
        group: 'item' as const,
      })),
      ...(activities.data ?? []).map((r) => ({
        code: String(r.code),
        label: String(r.name),
        group: 'activity' as const,
      })),
    ],
    [items.data, activities.data],
  );
  const focused = register.rows.find((r) => r._key === focusKey) ?? null;
  return (
    <RegisterTab
      page={page}
      readOnly={readOnly}
      columns={columns}
      aside={
        <DriverAppliesPanel
          row={focused}
          targets={options}
          readOnly={readOnly}
          onChange={(applies) =>
            focused && page.register.applyValues([{ key: focused._key, values: { applies } }])
          }
        />
      }
    />
  );
}

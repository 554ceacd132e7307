'use client';
// The frame every register tab shares: loading and failure states, the toolbar with import and
// export, the save notice, a warning before leaving rows not saved, and the grid (with an
// optional panel above it that folds away, so that the grid keeps the page's full width).
import type { ReactNode } from 'react';
import { RegisterGrid } from '@/components/grid/register-grid';
import { useLeaveWarning } from '@/components/grid/use-leave-warning';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import type { RegisterKind } from '@/lib/validation/registers';
import { FoldingPanel } from './folding-panel';
import { ImportExport } from './import-export';
import { RegisterNotice } from './register-notice';
import { RegisterToolbar } from './register-toolbar';
import { nextCode, type RegisterPage } from './use-register-page';

/** The props a register tab takes from its page. */
export type RegisterTabProps = { projectId: number; currency: string; readOnly: boolean };

/**
 * Each register's words: the grid's accessible name, what failed to load, the row noun, the
 * code a first row gets when no earlier code can be continued, what the empty grid says, and
 * how to start one.
 */
type TabWords = {
  label: string;
  subject: string;
  noun: string;
  plural?: string;
  firstCode: string;
  empty: string;
  start: string;
  /** The title of the panel above the grid, if the register has one. */
  panel?: string;
};

const TABS: Partial<Record<RegisterKind, TabWords>> = {
  items: {
    label: 'Line items',
    subject: 'The line items',
    noun: 'line',
    firstCode: '1.1',
    empty: 'No line items yet.',
    start: 'Add a line, paste lines from a spreadsheet, or import a file.',
  },
  risks: {
    label: 'Risk events',
    subject: 'The risk events',
    noun: 'risk',
    firstCode: 'R1',
    empty: 'No risk events yet.',
    start: 'Add a risk, paste risks from a spreadsheet, or import a file.',
    panel: 'Probability–impact matrix',
  },
  activities: {
    label: 'Schedule',
    subject: 'The schedule',
    noun: 'activity',
    plural: 'activities',
    firstCode: 'A1',
    empty: 'No activities yet.',
    start: 'Add an activity, paste activities from a spreadsheet, or import a file.',
  },
  drivers: {
    label: 'Drivers',
    subject: 'The drivers',
    noun: 'driver',
    plural: 'drivers',
    firstCode: 'D1',
    empty: 'No drivers yet.',
    start: 'Add a driver, paste drivers from a spreadsheet, or import a file.',
    panel: 'What the driver applies to',
  },
};

type Props = {
  page: RegisterPage;
  readOnly: boolean;
  columns: RegisterColumn[];
  /** The rows to show when they differ from the register's own (e.g. with network issues). */
  rows?: GridRow[];
  totalRow?: Record<string, unknown>;
  /** A panel above the grid, folded away on request (e.g. the probability–impact matrix). */
  aside?: ReactNode;
  /** A short note above the grid (e.g. the rules the model follows). */
  note?: ReactNode;
};

export function RegisterTab({ page, readOnly, columns, rows, totalRow, aside, note }: Props) {
  const { register, blank, projectId, kind } = page;
  const words = TABS[kind];
  if (!words) throw new Error(`The ${kind} register has no grid tab.`);
  const { label, subject, noun, plural, firstCode, empty, start, panel } = words;
  const unsaved = register.unsaved;
  const rowsNoun = (n: number) => (n === 1 ? noun : (plural ?? `${noun}s`));
  useLeaveWarning(
    unsaved > 0,
    `${unsaved} ${rowsNoun(unsaved)} not saved. They stay in this browser and come back when you return. Leave this page?`,
  );
  if (register.query.isPending) return <Skeleton rows={8} />;
  if (register.query.isError)
    return (
      <Notice tone="invalid">
        {subject} could not be loaded: {register.query.error.message}
      </Notice>
    );
  const codes = register.rows.map((r) => String(r.code ?? ''));
  const grid = (
    <RegisterGrid
      label={label}
      rows={rows ?? register.rows}
      columns={columns}
      readOnly={readOnly}
      onChange={register.applyValues}
      onAddRows={page.addRows}
      onSelectionChange={page.setSelected}
      onFocusRow={page.onFocusRow}
      totalRow={totalRow}
      emptyText={readOnly ? empty : `${empty} ${start}`}
    />
  );
  return (
    <div className="space-y-2">
      <RegisterToolbar
        readOnly={readOnly}
        selected={page.selected.length}
        saving={register.saving}
        unsaved={unsaved}
        count={register.rows.length}
        noun={noun}
        plural={plural}
        onAdd={() =>
          register.insertRow(register.rows.length, { ...blank(0), code: nextCode(codes, firstCode) })
        }
        onInsert={page.insert}
        onDelete={page.remove}
        onMove={page.move}
      >
        <ImportExport projectId={projectId} register={kind} readOnly={readOnly} />
      </RegisterToolbar>
      <RegisterNotice register={register} />
      {note}
      {aside ? (
        <FoldingPanel title={panel ?? label} storageKey={`outturn.panel.${kind}`}>
          {aside}
        </FoldingPanel>
      ) : null}
      {grid}
    </div>
  );
}

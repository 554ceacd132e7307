'use client';
// The frame every register tab shares: loading and failure states, the toolbar with import and
// export, the save notice, and the grid (with an optional panel beside it).
import type { ReactNode } from 'react';
import { RegisterGrid } from '@/components/grid/register-grid';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';
import { Skeleton } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import type { RegisterKind } from '@/lib/validation/registers';
import { ImportExport } from './import-export';
import { RegisterNotice } from './register-notice';
import { RegisterToolbar } from './register-toolbar';
import { nextCode, type RegisterPage } from './use-register-page';

type Props = {
  page: RegisterPage;
  projectId: number;
  kind: RegisterKind;
  readOnly: boolean;
  /** The grid's accessible name, e.g. "Line items". */
  label: string;
  /** What failed to load, e.g. "The line items". */
  subject: string;
  noun: string;
  plural?: string;
  /** The code a first row gets when no earlier code can be continued. */
  firstCode: string;
  columns: RegisterColumn[];
  /** The rows to show when they differ from the register's own (e.g. with network issues). */
  rows?: GridRow[];
  totalRow?: Record<string, unknown>;
  /** Said instead of an empty grid to a reader who cannot add rows. */
  emptyReadOnly?: string;
  /** A panel to the right of the grid. */
  aside?: ReactNode;
};

export function RegisterTab({
  page,
  projectId,
  kind,
  readOnly,
  label,
  subject,
  noun,
  plural,
  firstCode,
  columns,
  rows,
  totalRow,
  emptyReadOnly,
  aside,
}: Props) {
  const { register, blank } = page;
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
    />
  );
  return (
    <div className="space-y-2">
      <RegisterToolbar
        readOnly={readOnly}
        selected={page.selected.length}
        saving={register.saving}
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
      {emptyReadOnly && register.rows.length === 0 && readOnly ? (
        <p className="text-ink-soft">{emptyReadOnly}</p>
      ) : null}
      {aside ? (
        <div className="grid grid-cols-[1fr_auto] gap-3">
          <div className="min-w-0">{grid}</div>
          {aside}
        </div>
      ) : (
        grid
      )}
    </div>
  );
}

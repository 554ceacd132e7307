'use client';
// One register's grid: AG Grid (community) with our own editing loop. Edits, pastes and undo
// all become `onChange` calls; the grid never edits its data itself (readOnlyEdit), so what is
// shown is always what the register holds, drafts included.

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { AgGridReact } from 'ag-grid-react';
import {
  CellApiModule,
  CellStyleModule,
  ClientSideRowModelApiModule,
  ClientSideRowModelModule,
  ColumnApiModule,
  ColumnAutoSizeModule,
  CustomEditorModule,
  EventApiModule,
  ModuleRegistry,
  PinnedRowModule,
  RenderApiModule,
  RowApiModule,
  RowSelectionModule,
  RowStyleModule,
  ScrollApiModule,
  SelectEditorModule,
  TextEditorModule,
  TooltipModule,
  type CellEditRequestEvent,
  type CellFocusedEvent,
  type CellKeyDownEvent,
  type ColDef,
  type GridApi,
  type GridReadyEvent,
} from 'ag-grid-community';
import { outturnGridTheme } from './theme';
import { cellText, parseCell, type RegisterColumn } from './columns';
import { parseClipboardBlock } from './clipboard';
import { UndoStack, type CellChange } from './undo-stack';
import type { GridRow } from './use-register-rows';

// Only the grid features the registers use: the whole community set (filters, pagination, CSV
// export, other row models…) more than doubles the code a register tab loads before it can draw.
ModuleRegistry.registerModules([
  ClientSideRowModelModule,
  ClientSideRowModelApiModule,
  TextEditorModule,
  SelectEditorModule,
  CustomEditorModule,
  RowSelectionModule,
  PinnedRowModule,
  TooltipModule,
  CellStyleModule,
  RowStyleModule,
  ColumnAutoSizeModule,
  ColumnApiModule,
  RowApiModule,
  CellApiModule,
  ScrollApiModule,
  RenderApiModule,
  EventApiModule,
]);

export type GridChange = { key: string; values: Record<string, unknown> };

type Props = {
  label: string;
  rows: GridRow[];
  columns: RegisterColumn[];
  readOnly: boolean;
  onChange: (changes: GridChange[]) => void;
  /** Rows to add below the last one for a paste that runs past the end; returns their keys. */
  onAddRows?: (count: number, at: number) => string[];
  onSelectionChange?: (keys: string[]) => void;
  onFocusRow?: (key: string | null) => void;
  totalRow?: Record<string, unknown>;
  height?: number;
  onReady?: (api: GridApi) => void;
};

const editable = (col: RegisterColumn, row: GridRow | undefined) =>
  col.kind !== 'computed' && (!col.applies || (row ? col.applies(row) : true));

export function RegisterGrid({
  label,
  rows,
  columns,
  readOnly,
  onChange,
  onAddRows,
  onSelectionChange,
  onFocusRow,
  totalRow,
  height = 560,
  onReady,
}: Props) {
  const apiRef = useRef<GridApi<GridRow> | null>(null);
  const undo = useRef(new UndoStack());
  const [focusIssue, setFocusIssue] = useState<string | null>(null);
  const rowsRef = useRef(rows);
  useEffect(() => {
    rowsRef.current = rows;
  }, [rows]);
  const byField = useMemo(() => new Map(columns.map((c) => [c.field, c])), [columns]);

  const change = useCallback(
    (cells: CellChange[], record = true) => {
      if (!cells.length) return;
      if (record) undo.current.record(cells);
      const grouped = new Map<string, Record<string, unknown>>();
      for (const c of cells) grouped.set(c.key, { ...(grouped.get(c.key) ?? {}), [c.field]: c.after });
      onChange([...grouped].map(([key, values]) => ({ key, values })));
    },
    [onChange],
  );

  const colDefs = useMemo<ColDef<GridRow>[]>(() => {
    const defs: ColDef<GridRow>[] = columns.map((col) => ({
      colId: col.field,
      headerName: col.header,
      headerTooltip: col.headerTooltip ?? col.header,
      width: col.width ?? 110,
      pinned: col.pinned,
      sortable: false,
      suppressMovable: true,
      // Pinned (total) rows carry their figures in the fields themselves.
      valueGetter: (p) =>
        p.data ? (col.value && !p.node?.rowPinned ? col.value(p.data) : p.data[col.field]) : undefined,
      valueFormatter: (p) => (p.data ? cellText(col, p.value, p.data) : ''),
      editable: (p) => !readOnly && !p.node.rowPinned && editable(col, p.data),
      cellEditor: col.kind === 'choice' ? 'agSelectCellEditor' : 'agTextCellEditor',
      cellEditorParams:
        col.kind === 'choice' ? { values: (col.options ?? []).map((o) => o.label) } : { useFormatter: true },
      type:
        col.kind === 'number' || col.kind === 'percent' || col.kind === 'computed'
          ? 'rightAligned'
          : undefined,
      cellClass: (p) => {
        const row = p.data;
        if (!row || p.node.rowPinned) return 'font-semibold';
        const classes: string[] = [];
        if (col.kind === 'number' || col.kind === 'percent' || col.kind === 'computed') classes.push('num');
        if (row._issues[col.field]) classes.push('cell-invalid bg-invalid-light text-invalid');
        else if (row._mine && col.field in row._mine && row._mine[col.field] !== row[col.field])
          classes.push('bg-caution-light');
        else if (col.kind === 'computed') classes.push('text-ink-soft');
        else if (!editable(col, row)) classes.push('bg-paper-sunk/50 text-ink-faint');
        return classes.join(' ');
      },
      cellStyle: col.indent
        ? (p) =>
            p.data && !p.node.rowPinned ? { paddingLeft: `${8 + 14 * (col.indent!(p.data) - 1)}px` } : null
        : undefined,
      tooltipValueGetter: (p) => {
        const row = p.data;
        if (!row) return undefined;
        const issue = row._issues[col.field];
        if (issue) return issue;
        if (row._mine && col.field in row._mine && row._mine[col.field] !== row[col.field]) {
          return `Changed by someone else. Yours was: ${cellText(col, row._mine[col.field], row) || '(empty)'}`;
        }
        return undefined;
      },
    }));
    return defs;
  }, [columns, readOnly]);

  const onCellEditRequest = useCallback(
    (e: CellEditRequestEvent<GridRow>) => {
      const col = byField.get(e.colDef.colId ?? '');
      if (!col || !e.data) return;
      let text: unknown = e.newValue;
      if (col.kind === 'choice') text = col.options?.find((o) => o.label === e.newValue)?.value ?? e.newValue;
      const after = parseCell(col, text);
      change([{ key: e.data._key, field: col.field, before: e.data[col.field], after }]);
    },
    [byField, change],
  );

  const onCellFocused = useCallback(
    (e: CellFocusedEvent<GridRow>) => {
      if (e.rowIndex === null || e.rowPinned) {
        setFocusIssue(null);
        return;
      }
      const row = apiRef.current?.getDisplayedRowAtIndex(e.rowIndex)?.data;
      const field = typeof e.column === 'object' && e.column ? e.column.getColId() : String(e.column ?? '');
      setFocusIssue(row?._issues[field] ?? null);
      onFocusRow?.(row?._key ?? null);
    },
    [onFocusRow],
  );

  /** A tab-separated block pasted at the focused cell, over as many rows as it has. */
  const onPaste = useCallback(
    (e: React.ClipboardEvent) => {
      const api = apiRef.current;
      if (readOnly || !api || api.getEditingCells().length) return;
      const focused = api.getFocusedCell();
      if (!focused || focused.rowPinned) return;
      const block = parseClipboardBlock(e.clipboardData.getData('text/plain'));
      if (!block.length) return;
      e.preventDefault();
      const displayed = api
        .getAllDisplayedColumns()
        .map((c) => byField.get(c.getColId()))
        .filter(Boolean) as RegisterColumn[];
      const start = displayed.findIndex((c) => c.field === focused.column.getColId());
      if (start < 0) return;
      const targets = displayed.slice(start, start + block[0].length);
      const current = rowsRef.current;
      const missing = focused.rowIndex + block.length - current.length;
      const added = missing > 0 && onAddRows ? onAddRows(missing, current.length) : [];
      const keys = [
        ...current.slice(focused.rowIndex, focused.rowIndex + block.length).map((r) => r._key),
        ...added,
      ];
      const cells: CellChange[] = [];
      block.forEach((line, i) => {
        const key = keys[i];
        if (!key) return;
        const row = current.find((r) => r._key === key);
        targets.forEach((col, j) => {
          if (col.kind === 'computed' || j >= line.length) return;
          cells.push({
            key,
            field: col.field,
            before: row?.[col.field] ?? null,
            after: parseCell(col, line[j]),
          });
        });
      });
      change(cells);
    },
    [readOnly, byField, onAddRows, change],
  );

  const onKeyDownCapture = useCallback(
    (e: React.KeyboardEvent) => {
      const api = apiRef.current;
      if (readOnly || !api || api.getEditingCells().length) return;
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key.toLowerCase();
      if (mod && key === 'z' && !e.shiftKey) {
        e.preventDefault();
        e.stopPropagation();
        const cells = undo.current.undo();
        if (cells) change(cells, false);
      } else if (mod && (key === 'y' || (key === 'z' && e.shiftKey))) {
        e.preventDefault();
        e.stopPropagation();
        const cells = undo.current.redo();
        if (cells) change(cells, false);
      }
    },
    [readOnly, change],
  );

  const onCellKeyDown = useCallback(
    (e: CellKeyDownEvent<GridRow>) => {
      const ke = e.event as KeyboardEvent | undefined;
      if (readOnly || !ke || !e.data || e.node.rowPinned || e.api.getEditingCells().length) return;
      if (ke.key === 'Delete') {
        const col = byField.get(e.column.getColId());
        if (!col || !editable(col, e.data)) return;
        change([
          { key: e.data._key, field: col.field, before: e.data[col.field], after: parseCell(col, '') },
        ]);
      }
    },
    [readOnly, byField, change],
  );

  const onGridReady = useCallback(
    (e: GridReadyEvent<GridRow>) => {
      apiRef.current = e.api;
      onReady?.(e.api as GridApi);
    },
    [onReady],
  );

  return (
    <div onPaste={onPaste} onKeyDownCapture={onKeyDownCapture} className="space-y-1">
      <div style={{ height }} role="region" aria-label={label} data-testid={`grid-${label}`}>
        <AgGridReact<GridRow>
          theme={outturnGridTheme}
          rowData={rows}
          columnDefs={colDefs}
          getRowId={(p) => p.data._key}
          readOnlyEdit
          onCellEditRequest={onCellEditRequest}
          onCellFocused={onCellFocused}
          onCellKeyDown={onCellKeyDown}
          onGridReady={onGridReady}
          pinnedBottomRowData={totalRow ? [totalRow as GridRow] : undefined}
          rowSelection={
            readOnly
              ? undefined
              : { mode: 'multiRow', checkboxes: true, headerCheckbox: true, enableClickSelection: false }
          }
          onSelectionChanged={(e) => onSelectionChange?.(e.api.getSelectedRows().map((r) => r._key))}
          selectionColumnDef={{ pinned: 'left', width: 44 }}
          tooltipShowDelay={150}
          singleClickEdit={false}
          stopEditingWhenCellsLoseFocus
          enterNavigatesVerticallyAfterEdit
          suppressDragLeaveHidesColumns
          animateRows={false}
        />
      </div>
      <p className="min-h-5 text-xs" role="status" data-testid="cell-status">
        {focusIssue ? (
          <span className="text-invalid">{focusIssue}</span>
        ) : (
          <span className="text-ink-faint">
            {readOnly
              ? 'Read only.'
              : 'Enter or F2 edits · paste a block from a spreadsheet · Ctrl+Z / Ctrl+Y undo and redo · Delete clears a cell'}
          </span>
        )}
      </p>
    </div>
  );
}

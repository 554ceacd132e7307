'use client';
// One register's grid: AG Grid (community) with our own editing loop. Edits, pastes and undo
// all become `onChange` calls; the grid never edits its data itself (readOnlyEdit), so what is
// shown is always what the register holds, drafts included. A Delete is the grid's own "clear
// the cell" edit request, so one key press is one change and one save.

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
  LocaleModule,
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
  type ColDef,
  type ColGroupDef,
  type GridApi,
  type GridReadyEvent,
  type RowClassParams,
} from 'ag-grid-community';
import { outturnGridTheme } from './theme';
import { cellText, copyText, matchOption, parseCell, type RegisterColumn } from './columns';
import { formatClipboardBlock, parseClipboardBlock } from './clipboard';
import { blockBetween, inBlock, isMulti, type Block, type CellAt } from './cell-block';
import { UndoStack, type CellChange } from './undo-stack';
import type { GridRow } from './use-register-rows';

// Only the grid features the registers use: the whole community set (filters, pagination, CSV
// export, other row models…) more than doubles the code a register tab loads before it can draw.
ModuleRegistry.registerModules([
  ClientSideRowModelModule,
  // The grid's own words (the empty grid's overlay) are ours, given through the locale text.
  LocaleModule,
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
  /** What the grid says when the register has no rows. */
  emptyText?: string;
  height?: number;
  onReady?: (api: GridApi) => void;
};

const editable = (col: RegisterColumn, row: GridRow | undefined) =>
  col.kind !== 'computed' && (!col.applies || (row ? col.applies(row) : true));

/** Neighbouring columns that name the same group go under one group header. */
function groupColumns(
  columns: RegisterColumn[],
  defs: ColDef<GridRow>[],
): (ColDef<GridRow> | ColGroupDef<GridRow>)[] {
  const out: (ColDef<GridRow> | ColGroupDef<GridRow>)[] = [];
  columns.forEach((col, i) => {
    const last = out[out.length - 1];
    if (!col.group) out.push(defs[i]);
    else if (last && 'children' in last && last.groupId === `${col.group}:${i - last.children.length}`)
      last.children.push(defs[i]);
    // Open at first: a cell that shows only when its group is open (a normal's mean) is never hidden
    // while it holds the row's problem; the header's arrow closes the group to save width.
    else
      out.push({
        groupId: `${col.group}:${i}`,
        headerName: col.group,
        children: [defs[i]],
        openByDefault: true,
      });
  });
  return out;
}

const isFigure = (col: RegisterColumn) =>
  col.kind === 'number' || col.kind === 'percent' || col.kind === 'computed';

/** Columns narrower than this are sized to their content; wider ones (names, notes) keep their width. */
const FIT_BELOW = 150;

/**
 * The narrowest a column may get with its header wrapped between words, never inside one
 * (12 px semibold header text: about 7.5 px a character, plus the cell's padding).
 */
function headerMinWidth(header: string): number {
  const longest = Math.max(...header.split(/[\s/]+/).map((w) => w.length));
  return Math.max(56, Math.ceil(longest * 7.5 + 24));
}

const MOVES = new Set([
  'ArrowUp',
  'ArrowDown',
  'ArrowLeft',
  'ArrowRight',
  'Home',
  'End',
  'PageUp',
  'PageDown',
  'Tab',
  'Enter',
]);

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

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
  emptyText,
  height = 560,
  onReady,
}: Props) {
  const apiRef = useRef<GridApi<GridRow> | null>(null);
  const undo = useRef(new UndoStack());
  // The focused cell, by row key and field: its problem is read from the rows as they are now, so
  // a value put right while the cell keeps focus clears the message at once.
  const [focusCell, setFocusCell] = useState<{ key: string; field: string } | null>(null);
  const focusIssue = focusCell
    ? (rows.find((r) => r._key === focusCell.key)?._issues[focusCell.field] ?? null)
    : null;
  const rowsRef = useRef(rows);
  useEffect(() => {
    rowsRef.current = rows;
  }, [rows]);
  const byField = useMemo(() => new Map(columns.map((c) => [c.field, c])), [columns]);

  // The marked block, from an anchor cell to the focused one. It follows the input itself (a
  // click, a moving key's release) rather than the grid's focus events, which may come later.
  const anchor = useRef<CellAt | null>(null);
  const block = useRef<Block | null>(null);

  const change = useCallback(
    (cells: CellChange[], record = true) => {
      const real = cells.filter((c) => !same(c.before, c.after));
      if (!real.length) return;
      if (record) undo.current.record(real);
      const grouped = new Map<string, Record<string, unknown>>();
      for (const c of real) grouped.set(c.key, { ...(grouped.get(c.key) ?? {}), [c.field]: c.after });
      onChange([...grouped].map(([key, values]) => ({ key, values })));
    },
    [onChange],
  );

  /** The displayed columns that are register columns (not the selection checkboxes), left to right. */
  const displayedColumns = useCallback(
    (api: GridApi<GridRow>) => {
      return api
        .getAllDisplayedColumns()
        .map((c) => byField.get(c.getColId()))
        .filter(Boolean) as RegisterColumn[];
    },
    [byField],
  );

  const colDefs = useMemo<(ColDef<GridRow> | ColGroupDef<GridRow>)[]>(() => {
    const defs: ColDef<GridRow>[] = columns.map((col) => ({
      colId: col.field,
      headerName: col.header,
      headerTooltip: col.headerTooltip ?? col.header,
      width: Math.max(col.width ?? 110, headerMinWidth(col.header)),
      minWidth: headerMinWidth(col.header),
      pinned: col.pinned === undefined ? (col.kind === 'computed' ? 'right' : undefined) : col.pinned,
      sortable: false,
      suppressMovable: true,
      wrapHeaderText: true,
      autoHeaderHeight: true,
      headerClass: isFigure(col) ? 'ag-right-aligned-header' : undefined,
      // Pinned (total) rows carry their figures in the fields themselves.
      valueGetter: (p) =>
        p.data ? (col.value && !p.node?.rowPinned ? col.value(p.data) : p.data[col.field]) : undefined,
      valueFormatter: (p) => (p.data ? cellText(col, p.value, p.data) : ''),
      editable: (p) => !readOnly && !p.node.rowPinned && editable(col, p.data),
      // A drop-down cell opens its list on Enter, F2 or a double click; a typed letter starts a
      // text editor instead, and what is typed picks the matching option.
      cellEditorSelector:
        col.kind === 'choice' && !col.editor
          ? (p) =>
              p.eventKey && p.eventKey.length === 1
                ? { component: 'agTextCellEditor' }
                : {
                    component: 'agSelectCellEditor',
                    params: { values: (col.options ?? []).map((o) => o.label) },
                  }
          : undefined,
      cellEditor: col.editor?.component ?? (col.kind === 'choice' ? undefined : 'agTextCellEditor'),
      cellEditorParams: col.editor
        ? col.editor.params
        : col.kind === 'choice'
          ? undefined
          : { useFormatter: true },
      cellEditorPopup: col.editor?.popup,
      columnGroupShow: col.groupShow,
      cellClass: (p) => {
        const row = p.data;
        const classes: string[] = isFigure(col) ? ['num'] : [];
        if (!row || p.node.rowPinned) return [...classes, 'font-semibold'].join(' ');
        if (
          isMulti(block.current) &&
          inBlock(block.current, p.node.rowIndex ?? -1, p.api.getAllDisplayedColumns().indexOf(p.column))
        )
          classes.push('cell-in-block');
        if (row._issues[col.field]) classes.push('cell-invalid bg-invalid-light text-invalid');
        else if (row._mine && col.field in row._mine && row._mine[col.field] !== row[col.field])
          classes.push('bg-caution-light');
        else if (col.kind === 'computed') classes.push('text-ink-soft');
        else if (!editable(col, row)) classes.push('bg-paper-sunk/50 text-ink-faint');
        const own = !row._issues[col.field] && col.cellClass?.(row);
        if (own) classes.push(own);
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
    return groupColumns(columns, defs);
  }, [columns, readOnly]);

  const onCellEditRequest = useCallback(
    (e: CellEditRequestEvent<GridRow>) => {
      const col = byField.get(e.colDef.colId ?? '');
      if (!col || !e.data) return;
      let text: unknown = e.newValue;
      if (col.kind === 'choice' && typeof e.newValue === 'string') {
        const hit = matchOption(col.options ?? [], e.newValue);
        text = hit ? (hit.value ?? '') : e.newValue;
      }
      const after = parseCell(col, text);
      change([{ key: e.data._key, field: col.field, before: e.data[col.field], after }]);
    },
    [byField, change],
  );

  /**
   * After a click or a moving key: with Shift held the block runs from the anchor to the focused
   * cell, without it the focused cell is the new anchor. The marked cells are repainted.
   */
  const followFocus = useCallback((shift: boolean) => {
    const api = apiRef.current;
    if (!api) return;
    const had = isMulti(block.current);
    const focused = api.getFocusedCell();
    const col = focused
      ? api.getAllDisplayedColumns().findIndex((c) => c.getColId() === focused.column.getColId())
      : -1;
    if (!focused || focused.rowPinned || col < 0) {
      anchor.current = null;
      block.current = null;
    } else if (shift && anchor.current) {
      block.current = blockBetween(anchor.current, { row: focused.rowIndex, col });
    } else {
      anchor.current = { row: focused.rowIndex, col };
      block.current = blockBetween(anchor.current, anchor.current);
    }
    if (had || isMulti(block.current)) api.refreshCells({ force: true, suppressFlash: true });
  }, []);

  const onCellFocused = useCallback(
    (e: CellFocusedEvent<GridRow>) => {
      const api = apiRef.current;
      if (e.rowIndex === null || e.rowPinned) {
        setFocusCell(null);
        return;
      }
      const row = api?.getDisplayedRowAtIndex(e.rowIndex)?.data;
      const field = typeof e.column === 'object' && e.column ? e.column.getColId() : String(e.column ?? '');
      setFocusCell(row ? { key: row._key, field } : null);
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
      const pasted = parseClipboardBlock(e.clipboardData.getData('text/plain'));
      if (!pasted.length) return;
      e.preventDefault();
      const displayed = displayedColumns(api);
      const start = displayed.findIndex((c) => c.field === focused.column.getColId());
      if (start < 0) return;
      const targets = displayed.slice(start, start + pasted[0].length);
      const current = rowsRef.current;
      const missing = focused.rowIndex + pasted.length - current.length;
      const added = missing > 0 && onAddRows ? onAddRows(missing, current.length) : [];
      const keys = [
        ...current.slice(focused.rowIndex, focused.rowIndex + pasted.length).map((r) => r._key),
        ...added,
      ];
      const cells: CellChange[] = [];
      pasted.forEach((line, i) => {
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
    [readOnly, displayedColumns, onAddRows, change],
  );

  /**
   * Ctrl+C: the marked block (or the focused cell) as tab-separated text, as spreadsheets take
   * it. With no text selected the browser sends the copy event to the page's body, not to the
   * focused cell, so it is heard on the document while a cell of this grid has the focus.
   */
  const wrapper = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const onCopy = (e: ClipboardEvent) => {
      const api = apiRef.current;
      if (!api || !e.clipboardData || !wrapper.current?.contains(document.activeElement)) return;
      if (api.getEditingCells().length) return;
      const focused = api.getFocusedCell();
      if (!focused || focused.rowPinned) return;
      const shown = api.getAllDisplayedColumns();
      const colId = focused.column.getColId();
      const at = { row: focused.rowIndex, col: shown.findIndex((c) => c.getColId() === colId) };
      if (at.col < 0) return;
      // The marked block when it holds the focused cell, or else the focused cell alone.
      const b =
        block.current && inBlock(block.current, at.row, at.col) ? block.current : blockBetween(at, at);
      const picked = shown
        .slice(b.left, b.right + 1)
        .map((c) => byField.get(c.getColId()))
        .filter(Boolean) as RegisterColumn[];
      const lines: string[][] = [];
      for (let r = b.top; r <= b.bottom; r++) {
        const row = api.getDisplayedRowAtIndex(r)?.data;
        if (!row) continue;
        lines.push(picked.map((c) => copyText(c, c.value ? c.value(row) : row[c.field], row)));
      }
      e.preventDefault();
      e.clipboardData.setData('text/plain', formatClipboardBlock(lines));
    };
    document.addEventListener('copy', onCopy);
    return () => document.removeEventListener('copy', onCopy);
  }, [byField]);

  const onKeyDownCapture = useCallback(
    (e: React.KeyboardEvent) => {
      const api = apiRef.current;
      if (!api || api.getEditingCells().length) return;
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key.toLowerCase();
      // The browser copies only a text selection: the grid's copy runs through the copy event.
      if (mod && key === 'c' && !e.shiftKey && !e.altKey) {
        e.preventDefault();
        document.execCommand('copy');
        return;
      }
      if (readOnly) return;
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

  const onGridReady = useCallback(
    (e: GridReadyEvent<GridRow>) => {
      apiRef.current = e.api;
      onReady?.(e.api as GridApi);
    },
    [onReady],
  );

  /** Narrow columns take the width of their content once there are rows to measure. */
  const fitColumns = useCallback(() => {
    const api = apiRef.current;
    if (!api || api.getDisplayedRowCount() === 0) return;
    api.autoSizeColumns(
      columns.filter((c) => (c.width ?? 110) < FIT_BELOW).map((c) => c.field),
      true,
    );
  }, [columns]);

  return (
    <div
      ref={wrapper}
      onPaste={onPaste}
      onKeyDownCapture={onKeyDownCapture}
      onKeyUp={(e) => MOVES.has(e.key) && followFocus(e.shiftKey)}
      onClick={(e) => followFocus(e.shiftKey)}
      className="space-y-1"
    >
      <div style={{ height }} role="region" aria-label={label} data-testid={`grid-${label}`}>
        <AgGridReact<GridRow>
          theme={outturnGridTheme}
          rowData={rows}
          columnDefs={colDefs}
          getRowId={(p) => p.data._key}
          getRowClass={(p: RowClassParams<GridRow>) => (p.data?._draft ? 'row-draft' : undefined)}
          readOnlyEdit
          onCellEditRequest={onCellEditRequest}
          onCellFocused={onCellFocused}
          onGridReady={onGridReady}
          onFirstDataRendered={fitColumns}
          pinnedBottomRowData={totalRow ? [totalRow as GridRow] : undefined}
          localeText={{ noRowsToShow: emptyText ?? 'No rows yet.' }}
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
          // A register has a few dozen columns: all are drawn, so a block copied or a cell found
          // off to the side is there without scrolling to it first.
          suppressColumnVirtualisation
          animateRows={false}
        />
      </div>
      <p className="min-h-5 text-xs" role="status" data-testid="cell-status">
        {focusIssue ? (
          <span className="text-invalid">{focusIssue}</span>
        ) : (
          <span className="text-ink-faint">
            {readOnly
              ? 'Read only · Shift+click or Shift+arrows marks a block · Ctrl+C copies it'
              : 'Enter or F2 edits · paste a block from a spreadsheet · Shift+arrows marks a block, Ctrl+C copies it · Ctrl+Z / Ctrl+Y undo and redo · Delete clears a cell'}
          </span>
        )}
      </p>
    </div>
  );
}

'use client';
// Buttons above a grid: add, insert, delete, move; saving state; import and export.
import { Button } from '@/components/ui/button';

type Props = {
  readOnly: boolean;
  selected: number;
  saving: boolean;
  /** Rows in the grid not saved (unfinished or refused), kept in this browser. */
  unsaved: number;
  count: number;
  noun: string;
  plural?: string;
  onAdd: () => void;
  onInsert?: () => void;
  onDelete: () => void;
  onMove?: (by: number) => void;
  children?: React.ReactNode;
};

export function RegisterToolbar({
  readOnly,
  selected,
  saving,
  unsaved,
  count,
  noun,
  plural,
  onAdd,
  onInsert,
  onDelete,
  onMove,
  children,
}: Props) {
  const rows = (n: number) => (n === 1 ? noun : (plural ?? `${noun}s`));
  return (
    <div className="flex flex-wrap items-center gap-2">
      {readOnly ? (
        <span className="rounded border border-rule bg-paper-sunk px-2 py-1 text-xs text-ink-soft">
          Read only: your role can read and download this register.
        </span>
      ) : (
        <>
          <Button onClick={onAdd}>Add {noun}</Button>
          {onInsert ? (
            <Button variant="secondary" onClick={onInsert} title="Insert a row above the focused row">
              Insert above
            </Button>
          ) : null}
          {onMove ? (
            <>
              <Button
                variant="secondary"
                onClick={() => onMove(-1)}
                aria-label="Move the focused row up"
                title="Move the focused row up"
              >
                ↑
              </Button>
              <Button
                variant="secondary"
                onClick={() => onMove(1)}
                aria-label="Move the focused row down"
                title="Move the focused row down"
              >
                ↓
              </Button>
            </>
          ) : null}
          <Button variant="danger" disabled={selected === 0} onClick={onDelete}>
            Delete{selected ? ` ${selected}` : ''} selected
          </Button>
        </>
      )}
      <span className="text-xs text-ink-faint" aria-live="polite" data-testid="save-state">
        {count.toLocaleString('en-GB')} {rows(count)} ·{' '}
        {unsaved > 0 ? (
          <span
            className="font-semibold text-caution"
            title="Unfinished rows or values the register refused: they are kept in this browser until saved"
          >
            {saving ? 'Saving… · ' : ''}
            {unsaved.toLocaleString('en-GB')} {rows(unsaved)} not saved
          </span>
        ) : saving ? (
          'Saving…'
        ) : (
          'All changes saved'
        )}
      </span>
      <div className="ml-auto flex items-center gap-2">{children}</div>
    </div>
  );
}

'use client';
// Buttons above a grid: add, insert, delete, move; saving state; import and export.
import { Button } from '@/components/ui/button';

type Props = {
  readOnly: boolean;
  selected: number;
  saving: boolean;
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
  count,
  noun,
  plural,
  onAdd,
  onInsert,
  onDelete,
  onMove,
  children,
}: Props) {
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
      <span className="text-xs text-ink-faint" aria-live="polite">
        {count.toLocaleString('en-GB')} {count === 1 ? noun : (plural ?? `${noun}s`)} ·{' '}
        {saving ? 'Saving…' : 'All changes saved'}
      </span>
      <div className="ml-auto flex items-center gap-2">{children}</div>
    </div>
  );
}

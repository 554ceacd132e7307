'use client';
// What happened to the last save: refused (why), or changed by someone else (re-apply or keep).
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { useRegisterRows } from '@/components/grid/use-register-rows';

type SaveState = Pick<
  ReturnType<typeof useRegisterRows>,
  'notice' | 'conflicts' | 'reapplyMine' | 'keepTheirs' | 'setNotice'
>;

/** Takes the rows hook's save state as it is, so every register tab wires it the same way. */
export function RegisterNotice({ register }: { register: SaveState }) {
  const { notice, conflicts, reapplyMine: onReapply, keepTheirs: onKeepTheirs } = register;
  const onDismiss = () => register.setNotice(null);
  if (conflicts > 0) {
    return (
      <Notice tone="caution" title="Someone else changed these rows">
        <div className="flex flex-wrap items-center gap-3">
          <span>
            {conflicts === 1 ? 'One row shows' : `${conflicts} rows show`} the other person&apos;s values
            (cells in amber; hover to see yours).
          </span>
          <Button variant="secondary" onClick={onReapply}>
            Re-apply mine
          </Button>
          <Button variant="ghost" onClick={onKeepTheirs}>
            Keep theirs
          </Button>
        </div>
      </Notice>
    );
  }
  if (!notice) return null;
  return (
    <Notice tone={notice.tone}>
      <div className="flex items-start justify-between gap-3">
        <span data-testid="register-notice">{notice.text}</span>
        <button type="button" className="text-xs underline" onClick={onDismiss}>
          Dismiss
        </button>
      </div>
    </Notice>
  );
}

'use client';
// A panel above a grid that folds down to its title line, remembered in this browser, so that
// the grid below keeps the page's full width either way.
import { useId, useSyncExternalStore, type ReactNode } from 'react';

const listeners = new Set<() => void>();
const subscribe = (listener: () => void) => {
  listeners.add(listener);
  window.addEventListener('storage', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', listener);
  };
};

function readFolded(key: string): boolean {
  try {
    return window.localStorage.getItem(key) === 'folded';
  } catch {
    return false;
  }
}

function writeFolded(key: string, folded: boolean) {
  try {
    window.localStorage.setItem(key, folded ? 'folded' : 'open');
  } catch {
    // No storage: the panel simply opens again next time.
  }
  listeners.forEach((l) => l());
}

export function FoldingPanel({
  title,
  storageKey,
  children,
}: {
  title: string;
  storageKey: string;
  children: ReactNode;
}) {
  const folded = useSyncExternalStore(
    subscribe,
    () => readFolded(storageKey),
    () => false,
  );
  const id = useId();
  return (
    <section className="rounded border border-rule bg-paper-raised">
      <button
        type="button"
        className="flex w-full items-center gap-2 px-3 py-1.5 text-left text-sm font-semibold"
        aria-expanded={!folded}
        aria-controls={id}
        onClick={() => writeFolded(storageKey, !folded)}
      >
        <span aria-hidden className="inline-block w-3 text-ink-soft">
          {folded ? '▸' : '▾'}
        </span>
        {title}
        <span className="ml-auto text-xs font-normal text-ink-faint">{folded ? 'Show' : 'Fold away'}</span>
      </button>
      <div id={id} hidden={folded} className="border-t border-rule px-3 py-2">
        {children}
      </div>
    </section>
  );
}

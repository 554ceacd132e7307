'use client';
// A cell editor that picks several codes from a list (a risk's activities, its cost lines):
// a filter box over checkboxes. Enter in the filter ticks the first match; Enter on an empty
// filter, Tab or a click outside ends the edit; Escape leaves the cell as it was.

import { useEffect, useMemo, useRef, useState } from 'react';
import type { CustomCellEditorProps } from 'ag-grid-react';

export type CodeOption = { code: string; label: string };
type Params = { options: CodeOption[]; noun: string };

const SHOWN = 200;

export function CodePickEditor(props: CustomCellEditorProps & Params) {
  const { options, noun, onValueChange, stopEditing } = props;
  const [picked, setPicked] = useState<string[]>(() =>
    Array.isArray(props.value) ? props.value.map(String) : [],
  );
  const [filter, setFilter] = useState('');
  const matches = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return f ? options.filter((o) => `${o.code} ${o.label}`.toLowerCase().includes(f)) : options;
  }, [filter, options]);

  const toggle = (code: string) => {
    const next = picked.includes(code) ? picked.filter((c) => c !== code) : [...picked, code];
    setPicked(next);
    onValueChange(next);
  };
  // A native listener on the box itself: the grid hears keys on its own elements before React
  // does, and would end the edit on Enter.
  const input = useRef<HTMLInputElement>(null);
  const enter = useRef<() => void>(() => undefined);
  useEffect(() => {
    enter.current = () => {
      if (matches[0]) toggle(matches[0].code);
      setFilter('');
    };
  });
  useEffect(() => {
    const box = input.current;
    if (!box) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== 'Enter' || !box.value.trim()) return;
      e.preventDefault();
      e.stopPropagation();
      enter.current();
    };
    box.addEventListener('keydown', onKey);
    return () => box.removeEventListener('keydown', onKey);
  }, []);
  const unknown = picked.filter((c) => !options.some((o) => o.code === c));

  return (
    <div
      className="w-72 rounded border border-rule bg-paper p-2 text-sm shadow-lg"
      data-testid="code-pick-editor"
    >
      <input
        autoFocus
        aria-label={`Filter ${noun}`}
        className="mb-2 w-full rounded border border-rule px-2 py-1"
        placeholder={`Filter ${noun}… (Enter ticks the first)`}
        value={filter}
        ref={input}
        onChange={(e) => setFilter(e.target.value)}
      />
      <ul className="max-h-56 overflow-y-auto" role="group" aria-label={noun}>
        {matches.slice(0, SHOWN).map((o) => (
          <li key={o.code}>
            <label className="flex cursor-pointer items-center gap-2 px-1 py-0.5 hover:bg-paper-sunk">
              <input type="checkbox" checked={picked.includes(o.code)} onChange={() => toggle(o.code)} />
              <span className="font-medium">{o.code}</span>
              <span className="truncate text-ink-soft">{o.label}</span>
            </label>
          </li>
        ))}
        {matches.length === 0 ? <li className="px-1 text-ink-faint">No {noun} match.</li> : null}
        {matches.length > SHOWN ? (
          <li className="px-1 text-ink-faint">{matches.length - SHOWN} more: type to narrow.</li>
        ) : null}
      </ul>
      <div className="mt-2 flex items-center justify-between gap-2 text-xs text-ink-soft">
        <span>
          {picked.length} picked{unknown.length ? ` (unknown: ${unknown.join(', ')})` : ''}
        </span>
        <button
          type="button"
          className="rounded border border-rule px-2 py-0.5"
          onClick={() => stopEditing()}
        >
          Done
        </button>
      </div>
    </div>
  );
}

// Tables in one of the product's looks: the header row from a list of column titles.
import type { ReactNode, TableHTMLAttributes } from 'react';

/**
 * A column title, or a title with its alignment and any extra classes (`padding` in place of the
 * look's own).
 */
export type HeadCell =
  string | { title: ReactNode; align?: 'left' | 'right' | 'num'; className?: string; padding?: string };

type Look = { thead?: string; tr?: string; padding: string; th?: string; left?: string };

/** Medium-weight titles, left unless said otherwise. */
const MEDIUM = { padding: 'py-1', th: 'font-medium', left: 'text-left' };

const LOOKS = {
  /** Small grey titles over a rule, as in the brief's tables. */
  ruled: { ...MEDIUM, tr: 'border-b border-rule text-xs text-ink-soft' },
  /** Titles over a rule under a caption, as in the P-tables. */
  captioned: { ...MEDIUM, thead: 'text-xs text-ink-soft', tr: 'border-b border-rule' },
  /** Upper-case titles on a sunk band, for framed tables. */
  banded: {
    thead: 'bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft',
    padding: 'px-3 py-2',
  },
  /** Upper-case titles without a band, for tables inside a card. */
  plain: { thead: 'text-left text-xs uppercase tracking-wide text-ink-soft', padding: 'py-1' },
  /** Small titles on a sunk band, for narrow tables. */
  compact: { thead: 'bg-paper-sunk text-left text-xs text-ink-soft', padding: 'px-2 py-1' },
} satisfies Record<string, Look>;

const ALIGN = { right: 'text-right', num: 'num' };

export function TableHead({ look, cells }: { look: keyof typeof LOOKS; cells: HeadCell[] }) {
  const l: Look = LOOKS[look];
  return (
    <thead className={l.thead}>
      <tr className={l.tr}>
        {cells.map((cell, i) => {
          const c = typeof cell === 'string' ? { title: cell } : cell;
          const align = c.align && c.align !== 'left' ? ALIGN[c.align] : l.left;
          return (
            <th
              key={i}
              className={[c.padding ?? l.padding, l.th, align, c.className].filter(Boolean).join(' ')}
            >
              {c.title}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}

/** A table with its header row; the children are the body's rows. */
export function Table({
  look,
  head,
  children,
  ...table
}: {
  look: keyof typeof LOOKS;
  head: HeadCell[];
  children: ReactNode;
} & TableHTMLAttributes<HTMLTableElement>) {
  return (
    <table {...table}>
      <TableHead look={look} cells={head} />
      <tbody>{children}</tbody>
    </table>
  );
}

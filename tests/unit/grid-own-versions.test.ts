import { describe, expect, it } from 'vitest';
import { OwnVersions } from '@/components/grid/own-versions';

// Optimistic concurrency (common practice): each write names the version it read. A page that
// sends a second save before the first one's reply must name the version the first will leave,
// or it collides with itself; a version moved by someone else must stay stale.
describe("a page's own saves and the versions they leave", () => {
  it('sends a row at the version its earlier saves left it', () => {
    const own = new OwnVersions();
    own.saved(7, 3, 4);
    own.saved(7, 4, 5);
    expect(own.current(7, 3)).toBe(5);
    expect(own.current(7, 4)).toBe(5);
    expect(own.current(7, 5)).toBe(5);
    expect(own.current(8, 3)).toBe(3);
  });

  it('leaves a version it did not write untouched, so another person’s change still conflicts', () => {
    const own = new OwnVersions();
    own.saved(7, 3, 4);
    expect(own.current(7, 9)).toBe(9);
  });

  it('updates the rows and deletes of a batch', () => {
    const own = new OwnVersions();
    own.saved(1, 1, 2);
    own.saved(2, 5, 6);
    const batch = own.batch({
      upserts: [
        { id: 1, version: 1, code: 'A' },
        { key: 'n1', code: 'B' },
      ],
      deletes: [{ id: 2, version: 5 }],
    });
    expect(batch.upserts).toEqual([
      { id: 1, version: 2, code: 'A' },
      { key: 'n1', code: 'B' },
    ]);
    expect(batch.deletes).toEqual([{ id: 2, version: 6 }]);
  });
});

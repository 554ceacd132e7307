// The versions a page's own saves moved register rows through. Saves leave one after another;
// a save built before the reply of the one ahead of it still names the version it read, and
// must instead name the version that earlier save left, or it would collide with itself. A
// version this page did not write (another person's change) is left as it is, and still conflicts.

type VersionedBatch = {
  upserts: Record<string, unknown>[];
  deletes: { id: number; version: number }[];
};

export class OwnVersions {
  /** Row id → version sent → version saved. */
  private readonly steps = new Map<number, Map<number, number>>();

  /** Records that a save of row `id` sent at `sent` left it at `saved`. */
  saved(id: number, sent: number, saved: number): void {
    if (sent === saved) return;
    const row = this.steps.get(id) ?? new Map<number, number>();
    row.set(sent, saved);
    this.steps.set(id, row);
  }

  /** The version row `id` has once this page's saves from `version` on are through. */
  current(id: number, version: number): number {
    const row = this.steps.get(id);
    let v = version;
    for (let guard = 0; row?.has(v) && guard < 1000; guard++) v = row.get(v)!;
    return v;
  }

  /** The batch with each saved row at the version this page's earlier saves left it. */
  batch<B extends VersionedBatch>(batch: B): B {
    return {
      ...batch,
      upserts: batch.upserts.map((u) =>
        typeof u.id === 'number' && typeof u.version === 'number'
          ? { ...u, version: this.current(u.id, u.version) }
          : u,
      ),
      deletes: batch.deletes.map((d) => ({ ...d, version: this.current(d.id, d.version) })),
    };
  }
}

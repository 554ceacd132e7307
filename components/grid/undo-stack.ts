// Undo and redo of recent cell edits. One entry is one user action (a typed cell, a paste of
// many cells); undoing it writes the cells' previous values back through the normal save path.

export type CellChange = { key: string; field: string; before: unknown; after: unknown };

export class UndoStack {
  private done: CellChange[][] = [];
  private undone: CellChange[][] = [];
  constructor(private readonly limit = 100) {}

  record(changes: CellChange[]) {
    if (!changes.length) return;
    this.done.push(changes);
    if (this.done.length > this.limit) this.done.shift();
    this.undone = [];
  }

  /** The changes to apply to undo the last action (before ← after), or null. */
  undo(): CellChange[] | null {
    const last = this.done.pop();
    if (!last) return null;
    this.undone.push(last);
    return last.map((c) => ({ ...c, before: c.after, after: c.before }));
  }

  redo(): CellChange[] | null {
    const next = this.undone.pop();
    if (!next) return null;
    this.done.push(next);
    return next;
  }

  get canUndo() {
    return this.done.length > 0;
  }
  get canRedo() {
    return this.undone.length > 0;
  }
}

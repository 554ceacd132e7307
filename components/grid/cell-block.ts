// A rectangular block of cells marked with Shift+click or Shift+arrows, between the cell where
// the marking started (the anchor) and the focused cell, by displayed row and column position.

export type CellAt = { row: number; col: number };
export type Block = { top: number; bottom: number; left: number; right: number };

export function blockBetween(anchor: CellAt, focus: CellAt): Block {
  return {
    top: Math.min(anchor.row, focus.row),
    bottom: Math.max(anchor.row, focus.row),
    left: Math.min(anchor.col, focus.col),
    right: Math.max(anchor.col, focus.col),
  };
}

export function inBlock(block: Block | null, row: number, col: number): boolean {
  return block !== null && row >= block.top && row <= block.bottom && col >= block.left && col <= block.right;
}

/** Whether a block covers more than one cell (one cell is simply the focused cell). */
export function isMulti(block: Block | null): boolean {
  return block !== null && (block.bottom > block.top || block.right > block.left);
}

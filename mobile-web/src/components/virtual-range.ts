/** Which rows of a fixed-height list are on screen, with a few spare rows either side. */
export interface RowRange {
  /** First row to render (inclusive). */
  start: number;
  /** Row after the last to render (exclusive). */
  end: number;
}

export function visibleRows(scrollTop: number, viewportHeight: number, rowHeight: number, rowCount: number, overscan = 6): RowRange {
  if (rowCount === 0 || rowHeight <= 0) return { start: 0, end: 0 };
  const first = Math.floor(Math.max(0, scrollTop) / rowHeight);
  const shown = Math.ceil(Math.max(0, viewportHeight) / rowHeight) + 1;
  const start = Math.max(0, Math.min(rowCount - 1, first - overscan));
  const end = Math.min(rowCount, first + shown + overscan);
  return { start, end: Math.max(start, end) };
}

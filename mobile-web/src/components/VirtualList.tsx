import { useVirtualizer } from '@tanstack/react-virtual';
import { useRef, type ReactNode } from 'react';
import './VirtualList.css';

interface VirtualListProps<T> {
  items: readonly T[];
  /** The usual height of a row, px: the first guess before a row is measured (rows may differ). */
  rowHeight: number;
  rowKey(item: T): string;
  renderRow(item: T, index: number): ReactNode;
  label: string;
  testId?: string;
}

/**
 * A list that renders only the rows in view (and a few spare), so thousands of findings scroll
 * smoothly: the DOM holds about twenty rows whatever the length. @tanstack/react-virtual measures
 * each rendered row, so a row that wraps onto two lines (large text, a narrow phone) gets its room.
 */
export function VirtualList<T>({ items, rowHeight, rowKey, renderRow, label, testId }: VirtualListProps<T>) {
  const scroller = useRef<HTMLDivElement>(null);
  const virtualizer = useVirtualizer({
    count: items.length,
    getScrollElement: () => scroller.current,
    estimateSize: () => rowHeight,
    getItemKey: (index) => rowKey(items[index] as T),
    overscan: 6,
    // Before layout (and in tests without one) show a screenful rather than nothing.
    initialRect: { width: 390, height: 800 },
  });

  return (
    <div ref={scroller} className="virtual-list" data-testid={testId} aria-label={label}>
      <div className="virtual-list__spacer" role="list" aria-rowcount={items.length} style={{ height: virtualizer.getTotalSize() }}>
        {virtualizer.getVirtualItems().map((row) => (
          <div
            key={row.key}
            ref={virtualizer.measureElement}
            data-index={row.index}
            className="virtual-list__row"
            role="listitem"
            style={{ transform: `translateY(${row.start}px)` }}
          >
            {renderRow(items[row.index] as T, row.index)}
          </div>
        ))}
      </div>
    </div>
  );
}

import { useEffect, useLayoutEffect, useRef, useState, type ReactNode } from 'react';
import { visibleRows } from './virtual-range';
import './VirtualList.css';

interface VirtualListProps<T> {
  items: readonly T[];
  /** Every row has this height, px (the row's CSS must keep to it). */
  rowHeight: number;
  rowKey(item: T): string;
  renderRow(item: T, index: number): ReactNode;
  label: string;
  testId?: string;
}

/**
 * A list that renders only the rows in view (and a few spare), so thousands of findings scroll
 * smoothly: the DOM holds about twenty rows whatever the length. Fixed row height keeps the maths
 * exact and free of measuring.
 */
export function VirtualList<T>({ items, rowHeight, rowKey, renderRow, label, testId }: VirtualListProps<T>) {
  const scroller = useRef<HTMLDivElement>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const [viewportHeight, setViewportHeight] = useState(800);
  const frame = useRef(0);

  useLayoutEffect(() => {
    const element = scroller.current;
    if (!element) return;
    setViewportHeight(element.clientHeight || 800);
    const observer = new ResizeObserver(() => setViewportHeight(element.clientHeight || 800));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  useEffect(() => () => cancelAnimationFrame(frame.current), []);

  function onScroll() {
    cancelAnimationFrame(frame.current);
    frame.current = requestAnimationFrame(() => setScrollTop(scroller.current?.scrollTop ?? 0));
  }

  const { start, end } = visibleRows(scrollTop, viewportHeight, rowHeight, items.length);
  const rows: ReactNode[] = [];
  for (let index = start; index < end; index++) {
    const item = items[index] as T;
    rows.push(
      <div key={rowKey(item)} className="virtual-list__row" role="listitem" style={{ top: index * rowHeight, height: rowHeight }}>
        {renderRow(item, index)}
      </div>,
    );
  }

  return (
    <div ref={scroller} className="virtual-list" onScroll={onScroll} data-testid={testId} aria-label={label}>
      <div className="virtual-list__spacer" role="list" aria-rowcount={items.length} style={{ height: items.length * rowHeight }}>
        {rows}
      </div>
    </div>
  );
}

import type { ReactNode } from 'react';

/**
 * A wide table that scrolls sideways on a narrow screen. Focusable and named, so someone without a
 * pointer can reach the columns out of view with the arrow keys.
 */
export function TableScroll({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="manager-table-wrap" tabIndex={0} role="region" aria-label={label}>
      {children}
    </div>
  );
}

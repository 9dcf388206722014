import { useEffect, useId, useRef, type ReactNode } from 'react';
import './Sheet.css';

interface SheetProps {
  open: boolean;
  title: string;
  onClose(): void;
  children: ReactNode;
  /** Actions at the bottom, in thumb reach. */
  footer?: ReactNode;
  testId?: string;
}

/**
 * A sheet rising from the bottom, on the browser's own modal dialog: focus is trapped and
 * restored, Escape and the back gesture close it, and no overlay framework has to load.
 */
export function Sheet({ open, title, onClose, children, footer, testId }: SheetProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const titleId = useId();

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (open && !element.open) element.showModal();
    if (!open && element.open) element.close();
  }, [open]);

  return (
    <dialog
      ref={dialog}
      className="sheet"
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      onClick={(event) => {
        if (event.target === dialog.current) onClose(); // a tap on the backdrop
      }}
      data-testid={testId}
    >
      {open && (
        <div className="sheet__frame">
          <header className="sheet__header">
            <h2 id={titleId} className="sheet__title">
              {title}
            </h2>
            <button type="button" className="sheet__close" onClick={onClose}>
              Close
            </button>
          </header>
          <div className="sheet__body">{children}</div>
          {footer && <footer className="sheet__footer">{footer}</footer>}
        </div>
      )}
    </dialog>
  );
}

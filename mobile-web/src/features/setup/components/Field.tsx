import type { ReactNode } from 'react';

interface FieldProps {
  /** The id of the input inside, for the label and the error's aria link. */
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}

/** A labelled form field with its hint and, when refused, the reason in words under it. */
export function Field({ id, label, hint, error, children }: FieldProps) {
  return (
    <div className={`setup-field ${error ? 'setup-field--error' : ''}`}>
      <label htmlFor={id}>{label}</label>
      {children}
      {hint && !error && <small className="setup-field__hint">{hint}</small>}
      {error && (
        <small className="setup-field__error" id={`${id}-error`} role="alert" data-testid={`error-${id}`}>
          {error}
        </small>
      )}
    </div>
  );
}

/** Props for an input inside a Field: ties it to the error message. */
export const describedBy = (id: string, error: string | undefined) => ({
  id,
  'aria-invalid': error ? true : undefined,
  'aria-describedby': error ? `${id}-error` : undefined,
});

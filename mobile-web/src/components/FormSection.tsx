import type { ReactNode } from 'react';

/** A titled block of a long form; the title is a heading so screen readers can jump between blocks. */
export function FormSection({ title, children, testId }: { title: string; children: ReactNode; testId?: string }) {
  return (
    <section className="form-section" data-testid={testId}>
      <h2 className="form-section__title">{title}</h2>
      {children}
    </section>
  );
}

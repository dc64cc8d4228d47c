import { useId, type ReactNode } from 'react';

/** One component of the bank on the walk: its name, what the register says of it, then its readings. */
export function ComponentCard({ title, facts, children, testId }: { title: string; facts?: ReactNode; children: ReactNode; testId?: string }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} data-testid={testId} className="grid min-w-0 gap-4 rounded-md border border-line bg-surface p-4 desk:p-6">
      <header className="grid gap-1">
        <h3 id={headingId} className="text-lg font-semibold">
          {title}
        </h3>
        {facts && <p className="text-base text-ink-muted">{facts}</p>}
      </header>
      {children}
    </section>
  );
}

/** A titled group of fields inside a card (the readings, the visual checks, notes and photos). */
export function FieldGroup({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="grid min-w-0 gap-3 border-t border-line pt-3">
      <legend className="float-left mb-1 w-full font-semibold">{legend}</legend>
      {children}
    </fieldset>
  );
}

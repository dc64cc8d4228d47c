import type { ReactNode } from 'react';

export type Fact = { label: string; value: ReactNode; testId?: string };

/** Label and value pairs of a record: two columns on a desk, stacked on a phone. */
export function RecordFacts({ facts }: { facts: ReadonlyArray<Fact | false | null | undefined> }) {
  return (
    <dl className="grid gap-x-6 gap-y-3 desk:grid-cols-[minmax(10rem,auto)_1fr]">
      {facts.filter((fact): fact is Fact => Boolean(fact)).map((fact) => (
        <div key={fact.label} className="grid gap-0.5 desk:col-span-2 desk:grid-cols-subgrid">
          <dt className="text-base text-ink-muted desk:text-sm">{fact.label}</dt>
          <dd data-testid={fact.testId} className="min-w-0 break-words">
            {fact.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

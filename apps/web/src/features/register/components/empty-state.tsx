import type { ReactNode } from 'react';

/** Where a list or a picture will fill in later: says what is missing and why, in plain words. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-md border border-dashed border-line-strong bg-sunken px-4 py-6 text-center">
      <p className="font-medium">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-measure text-base text-ink-muted desk:text-sm">{children}</div>}
    </div>
  );
}

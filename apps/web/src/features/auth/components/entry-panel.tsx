import type { ReactNode } from 'react';

type EntryPanelProps = { title: string; lead?: ReactNode; children: ReactNode };

/** The narrow column of the pages reached before signing in: sign in, get a link, choose a password. */
export function EntryPanel({ title, lead, children }: EntryPanelProps) {
  return (
    <div className="mx-auto w-full max-w-[28rem] desk:pt-8">
      <title>{`${title} · Varden`}</title>
      <h1 className="text-xl font-semibold desk:text-2xl">{title}</h1>
      {lead && <p className="mt-2 text-ink-muted">{lead}</p>}
      <div className="mt-6 rounded-md border border-line bg-surface p-4 desk:p-6">{children}</div>
    </div>
  );
}

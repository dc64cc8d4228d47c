import type { ReactNode } from 'react';

type PageHeaderProps = {
  title: string;
  /** A short line above the title naming the section, when the title is not the section. */
  eyebrow?: string;
  lead?: ReactNode;
  actions?: ReactNode;
  /** The browser tab's title; defaults to the page title. */
  documentTitle?: string;
};

export function PageHeader({ title, eyebrow, lead, actions, documentTitle }: PageHeaderProps) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-line pb-4">
      <title>{`${documentTitle ?? title} · Varden`}</title>
      <div className="min-w-0 max-w-measure">
        {eyebrow && <p className="mb-1 text-base font-medium text-ink-muted desk:text-sm">{eyebrow}</p>}
        <h1 className="text-xl font-semibold desk:text-2xl">{title}</h1>
        {lead && <p className="mt-2 text-base text-ink-muted">{lead}</p>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}

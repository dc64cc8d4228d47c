import { Link } from 'react-router-dom';

/** Where a record sits in the register: Sites › site › bank …; the last entry is this page. */
export function Breadcrumbs({ trail }: { trail: ReadonlyArray<{ label: string; href?: string }> }) {
  return (
    <nav aria-label="Breadcrumb" className="mb-2" data-print="hide">
      <ol className="flex flex-wrap items-center gap-x-2 text-base desk:text-sm">
        {trail.map((entry, index) => (
          <li key={`${entry.label}-${index}`} className="flex min-h-touch items-center gap-2 desk:min-h-0">
            {index > 0 && (
              <span aria-hidden="true" className="text-ink-muted">
                ›
              </span>
            )}
            {entry.href ? <Link to={entry.href}>{entry.label}</Link> : <span aria-current="page">{entry.label}</span>}
          </li>
        ))}
      </ol>
    </nav>
  );
}

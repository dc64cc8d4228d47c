import { matchPath } from 'react-router-dom';

export type RailSection = {
  href: string;
  /** Route patterns of pages that live under another section's address but belong to this one. */
  alsoOn?: readonly string[];
};

/** Whether `pathname` is the section's address or below it; a query in the address (a default filter) does not count. */
const within = (pathname: string, href: string) => {
  const base = href.split('?')[0]!;
  return pathname === base || pathname.startsWith(base.endsWith('/') ? base : `${base}/`);
};

/**
 * The rail's entry for a page: a section that claims the page's pattern first (a site's health
 * lives under /sites/… but belongs to fleet health), else the section whose address is the
 * longest leading part of the page's, whole path segments only.
 */
export function currentSection<S extends RailSection>(sections: readonly S[], pathname: string): S | undefined {
  const claimed = sections.find((s) => s.alsoOn?.some((pattern) => matchPath({ path: pattern, end: true }, pathname)));
  if (claimed) return claimed;
  let best: S | undefined;
  for (const s of sections) if (within(pathname, s.href) && (!best || s.href.length > best.href.length)) best = s;
  return best;
}

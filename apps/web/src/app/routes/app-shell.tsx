import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import type { Permission } from '@varden/schemas';
import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { Link, Outlet, useLocation, useNavigation } from 'react-router-dom';
import { NoticeArea } from '../../components/notice-area';
import { SafetyNote } from '../../components/safety-note';
import { ThemeSwitch } from '../../components/theme-switch';
import { paths } from '../../config/paths';
import { session, type SessionResponse } from '../../features/auth/api/session-queries';
import { AccountBlock } from '../../features/auth/components/account-block';
import { permitted } from '../../features/auth/lib/permitted';
import { openStatesFilter } from '../../features/work-orders/lib/work-order-search';
import { loadSession } from '../../features/auth/lib/route-guards';
import { classNames } from '../../lib/class-names';
import { currentSection, type RailSection } from './current-section';

export type Section = RailSection & { label: string; permission?: Permission };

// The rail: one entry per section, shown to those whose permissions include the entry's
// (the server decides anyway). Each role's home comes first, then the shared sections.
export const sections: readonly Section[] = [
  { label: 'Planning desk', href: paths.planningDesk.getHref(), permission: 'work-orders:schedule' },
  { label: 'Today’s orders', href: paths.todaysOrders.getHref(), permission: 'work-orders:perform' },
  { label: 'Review queue', href: paths.reviewQueue.getHref(), permission: 'work-orders:review' },
  // Opens on the open orders, most urgent first; the state filter offers the sealed and withdrawn ones.
  { label: 'Work orders', href: paths.workOrders.list.getHref(new URLSearchParams({ state: openStatesFilter })), permission: 'work-orders:read' },
  { label: 'Inspection plans', href: paths.plans.list.getHref(), permission: 'plans:manage' },
  { label: 'Flag queue', href: paths.flagQueue.getHref(), permission: 'work-orders:schedule' },
  { label: 'Site health', href: paths.siteHealth.getHref(), permission: 'reports:read' },
  { label: 'Fleet health', href: paths.fleetHealth.getHref(), permission: 'reports:read', alsoOn: [paths.siteHealthOf.path] },
  { label: 'Register', href: paths.register.sites.getHref(), permission: 'register:read' },
  { label: 'People', href: paths.people.getHref(), permission: 'users:manage' },
  { label: 'Audit log', href: paths.auditLog.getHref(), permission: 'audit-log:read' },
  { label: 'Service health', href: paths.serviceHealth.getHref(), permission: 'settings:manage' },
];

/** The shell's loader: who is signed in, if anyone, before any page draws. */
export const shellLoader = (queryClient: QueryClient) => () => loadSession(queryClient);

function Mark() {
  // A capacitor's two plates, in copper.
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 20 20" className="size-5 fill-none stroke-frame-focus stroke-2">
      <path d="M1 10h6M13 10h6M7 3v14M13 3v14" strokeLinecap="round" />
    </svg>
  );
}

function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only z-50 rounded bg-surface font-medium text-ink focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:px-4 focus:py-3 focus-visible:outline-frame-focus"
    >
      Skip to content
    </a>
  );
}

function LoadingBar() {
  const navigation = useNavigation();
  if (navigation.state === 'idle') return null;
  return <div role="progressbar" aria-label="Loading page" className="fixed inset-x-0 top-0 z-50 h-1 animate-pulse bg-copper" />;
}

function Brand({ to }: { to: string }) {
  return (
    <Link to={to} className="inline-flex min-h-touch items-center gap-2 rounded text-lg font-semibold text-frame-ink no-underline">
      <Mark />
      Varden
    </Link>
  );
}

/**
 * The frame around every page. Signed in, on a desk: a narrow rail of sections on the left with
 * the user menu at its foot; on a phone (640 px and narrower): a top header whose Menu button
 * opens the same sections and user menu. Signed out: a plain header over the entry pages.
 */
export function AppShell() {
  const { data: me } = useQuery(session);
  return me ? <SignedInFrame me={me} /> : <EntryFrame />;
}

function EntryFrame() {
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <LoadingBar />
      <header data-surface="frame" data-print="hide" className="bg-frame px-4 py-1 text-frame-ink">
        <Brand to={paths.signIn.getHref()} />
      </header>
      <main id="main" tabIndex={-1} className="w-full flex-1 px-4 py-6 focus-visible:outline-none desk:py-10">
        <Outlet />
      </main>
      <footer className="border-t border-line px-4 py-4">
        <div className="mx-auto max-w-[28rem]">
          <SafetyNote />
        </div>
      </footer>
      <NoticeArea />
    </div>
  );
}

function SignedInFrame({ me }: { me: SessionResponse }) {
  const [menuOpen, setMenuOpen] = useState(false);
  const menuButton = useRef<HTMLButtonElement>(null);
  const menuId = useId();
  const closeMenu = () => setMenuOpen(false);
  const { pathname } = useLocation();
  const shown = permitted(sections, me);
  const current = currentSection(shown, pathname);

  const closeMenuOnEscape = (event: KeyboardEvent) => {
    if (event.key !== 'Escape' || !menuOpen) return;
    setMenuOpen(false);
    menuButton.current?.focus();
  };

  return (
    <div className="min-h-dvh desk:flex">
      <SkipLink />
      <LoadingBar />

      <header
        data-surface="frame"
        data-print="hide"
        onKeyDown={closeMenuOnEscape}
        className="bg-frame text-frame-ink desk:sticky desk:top-0 desk:flex desk:h-dvh desk:w-rail desk:shrink-0 desk:flex-col desk:overflow-y-auto desk:border-r desk:border-frame-active"
      >
        <div className="flex min-h-touch items-center justify-between gap-2 px-4 py-1 desk:py-4">
          <Brand to={paths.home.getHref()} />
          <button
            ref={menuButton}
            type="button"
            aria-expanded={menuOpen}
            aria-controls={menuId}
            onClick={() => setMenuOpen((open) => !open)}
            className="inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded px-3 text-base font-medium desk:hidden"
          >
            <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 fill-none stroke-current stroke-2">
              <path d={menuOpen ? 'M3 3l10 10M13 3 3 13' : 'M2 4h12M2 8h12M2 12h12'} strokeLinecap="round" />
            </svg>
            Menu
          </button>
        </div>

        <div
          id={menuId}
          className={classNames(
            menuOpen ? 'flex' : 'hidden',
            'flex-col gap-6 border-t border-frame-active px-2 pt-2 pb-4 desk:flex desk:flex-1 desk:border-t-0 desk:pt-0',
          )}
        >
          <nav aria-label="Sections">
            <ul className="grid gap-1">
              {shown.map((section) => (
                <li key={section.href}>
                  <Link
                    to={section.href}
                    onClick={closeMenu}
                    aria-current={section === current ? 'page' : undefined}
                    className={classNames(
                      'flex min-h-touch items-center rounded border-l-4 px-3 text-base text-frame-ink no-underline desk:min-h-control desk:text-sm',
                      section === current ? 'border-frame-focus bg-frame-active font-semibold' : 'border-transparent hover:bg-frame-active',
                    )}
                  >
                    {section.label}
                  </Link>
                </li>
              ))}
            </ul>
          </nav>
          <div className="grid gap-4 desk:mt-auto">
            <AccountBlock me={me} onNavigate={closeMenu} />
            <div className="px-1">
              <ThemeSwitch />
            </div>
          </div>
        </div>
      </header>

      <div className="flex min-w-0 flex-1 flex-col">
        <main id="main" tabIndex={-1} className="w-full max-w-content flex-1 px-4 py-6 focus-visible:outline-none desk:px-8 desk:py-8">
          <Outlet />
        </main>
        <footer className="border-t border-line px-4 py-4 desk:px-8">
          <SafetyNote />
        </footer>
      </div>

      <NoticeArea />
    </div>
  );
}

/** Shown while the first page's code loads. */
export function ShellFallback() {
  return (
    <p role="status" className="p-6 text-ink-muted">
      Loading Varden…
    </p>
  );
}

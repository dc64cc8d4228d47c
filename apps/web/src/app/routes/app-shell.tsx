import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { Link, NavLink, Outlet, useNavigation } from 'react-router-dom';
import { NoticeArea } from '../../components/notice-area';
import { SafetyNote } from '../../components/safety-note';
import { ThemeSwitch } from '../../components/theme-switch';
import { paths } from '../../config/paths';
import { classNames } from '../../lib/class-names';

type Section = { label: string; href: string; end?: boolean };

// The rail lists one entry per section. Register, Work orders, Fleet health and People join
// here, in that order, as their pages land.
const sections: readonly Section[] = [{ label: 'Overview', href: paths.home.getHref(), end: true }];

function Mark() {
  // A capacitor's two plates, in copper.
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 20 20" className="size-5 fill-none stroke-frame-focus stroke-2">
      <path d="M1 10h6M13 10h6M7 3v14M13 3v14" strokeLinecap="round" />
    </svg>
  );
}

/**
 * The frame around every page. On a desk: a narrow rail of sections on the left. On a phone
 * (640 px and narrower): a top header whose menu button opens the same sections.
 */
export function AppShell() {
  const [menuOpen, setMenuOpen] = useState(false);
  const menuButton = useRef<HTMLButtonElement>(null);
  const menuId = useId();
  const navigation = useNavigation();

  const closeMenuOnEscape = (event: KeyboardEvent) => {
    if (event.key !== 'Escape' || !menuOpen) return;
    setMenuOpen(false);
    menuButton.current?.focus();
  };

  return (
    <div className="min-h-dvh desk:flex">
      <a
        href="#main"
        className="sr-only z-50 rounded bg-surface font-medium text-ink focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:px-4 focus:py-3 focus-visible:outline-frame-focus"
      >
        Skip to content
      </a>

      {navigation.state !== 'idle' && (
        <div role="progressbar" aria-label="Loading page" className="fixed inset-x-0 top-0 z-50 h-1 animate-pulse bg-copper" />
      )}

      <header
        data-surface="frame"
        data-print="hide"
        onKeyDown={closeMenuOnEscape}
        className="bg-frame text-frame-ink desk:sticky desk:top-0 desk:flex desk:h-dvh desk:w-rail desk:shrink-0 desk:flex-col desk:border-r desk:border-frame-active"
      >
        <div className="flex min-h-touch items-center justify-between gap-2 px-4 py-1 desk:py-5">
          <Link
            to={paths.home.getHref()}
            className="inline-flex items-center gap-2 rounded text-lg font-semibold text-frame-ink no-underline"
          >
            <Mark />
            Varden
          </Link>
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
              {sections.map((section) => (
                <li key={section.href}>
                  <NavLink
                    to={section.href}
                    end={section.end ?? false}
                    onClick={() => setMenuOpen(false)}
                    className={({ isActive }) =>
                      classNames(
                        'flex min-h-touch items-center rounded border-l-4 px-3 text-base text-frame-ink no-underline desk:min-h-control desk:text-sm',
                        isActive ? 'border-frame-focus bg-frame-active font-semibold' : 'border-transparent hover:bg-frame-active',
                      )
                    }
                  >
                    {section.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="px-1 desk:mt-auto">
            <ThemeSwitch />
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

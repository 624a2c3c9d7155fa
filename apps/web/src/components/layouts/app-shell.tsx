import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import type { NavEntry } from '../../config/nav.ts';
import { PRODUCT_NAME } from '../../hooks/use-document-title.ts';
import { MainNav } from './main-nav.tsx';

export interface AppShellProps {
  guildName?: string | undefined;
  homeHref: string;
  /** Main navigation; empty for signed-out visitors. */
  nav: readonly NavEntry[];
  /** Right side of the header: the member's name, or sign-in/join links. */
  headerEnd?: ReactNode;
  children: ReactNode;
}

export const MAIN_ID = 'main';

export function AppShell({ guildName, homeHref, nav, headerEnd, children }: AppShellProps) {
  const [menuOpen, setMenuOpen] = useState(false);
  const menuId = useId();
  const menuButton = useRef<HTMLButtonElement>(null);
  const location = useLocation();

  // A chosen link has done its job: fold the phone menu away on every navigation.
  useEffect(() => setMenuOpen(false), [location.pathname]);

  return (
    // A size container: the sidebar's breakpoint is in rem of the page's own text size, so enlarged text folds the menu away.
    <div className="@container flex min-h-dvh flex-col">
      <a
        href={`#${MAIN_ID}`}
        className="sr-only z-50 rounded-stitch bg-thread font-semibold text-white focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:inline-flex focus:min-h-11 focus:items-center focus:px-4 focus:py-2 hover:text-white"
      >
        Skip to main content
      </a>

      <header className="border-b-4 border-madder bg-linen-deep">
        <div className="mx-auto flex max-w-7xl items-center justify-between gap-3 px-4 py-3 sm:px-6">
          <Link to={homeHref} className="group flex min-w-0 items-center gap-3 text-thread no-underline hover:text-thread">
            <SpoolMark />
            <span className="min-w-0 leading-tight">
              <span className="block text-2xl font-bold group-hover:underline">{PRODUCT_NAME}</span>
              {guildName ? <span className="block text-thread-soft">{guildName}</span> : null}
            </span>
          </Link>
          <div className="flex shrink-0 items-center gap-2">
            {headerEnd}
            {nav.length > 0 ? (
              <button
                ref={menuButton}
                type="button"
                aria-expanded={menuOpen}
                aria-controls={menuId}
                onClick={() => setMenuOpen((open) => !open)}
                className="inline-flex min-h-11 min-w-11 items-center gap-2 rounded-stitch border-2 border-thread bg-muslin px-4 font-semibold @min-[60rem]:hidden"
              >
                <span aria-hidden="true" className="text-xl leading-none">
                  {menuOpen ? '✕' : '☰'}
                </span>
                Menu
                {menuOpen ? null : nav.map((entry) => (entry.Count ? <entry.Count key={entry.page.path} onMenuButton /> : null))}
              </button>
            ) : null}
          </div>
        </div>
      </header>

      <div className="mx-auto flex w-full max-w-7xl flex-1 flex-col @min-[60rem]:flex-row">
        {nav.length > 0 ? (
          <MainNav
            id={menuId}
            entries={nav}
            open={menuOpen}
            onClose={() => {
              setMenuOpen(false);
              menuButton.current?.focus();
            }}
          />
        ) : null}
        <main id={MAIN_ID} tabIndex={-1} className="min-w-0 flex-1 px-4 py-8 focus:outline-none sm:px-6 sm:py-10">
          {children}
        </main>
      </div>

      <footer className="border-t-2 border-seam px-4 py-6 text-thread-soft sm:px-6">
        <p className="mx-auto max-w-7xl">
          {PRODUCT_NAME} is {guildName ? `${guildName}'s` : 'the guild’s'} own exchange for fabric scraps, run by its members.
        </p>
      </footer>
    </div>
  );
}

/** A thread spool drawn in the palette, as the product's mark. */
function SpoolMark() {
  return (
    <svg aria-hidden="true" viewBox="0 0 40 40" className="size-9 shrink-0 sm:size-11">
      <rect x="8" y="4" width="24" height="5" rx="2" className="fill-thread" />
      <rect x="8" y="31" width="24" height="5" rx="2" className="fill-thread" />
      <rect x="11" y="9" width="18" height="22" className="fill-madder" />
      <path d="M11 13h18M11 17h18M11 21h18M11 25h18" className="stroke-madder-deep" strokeWidth="1.5" />
      <path d="M29 20c6 2 6 10 0 14" className="fill-none stroke-thread" strokeWidth="1.5" strokeDasharray="2 2" />
    </svg>
  );
}

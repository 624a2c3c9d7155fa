import { useEffect, useId, useState, type ReactNode } from 'react';
import { Link, NavLink, useLocation } from 'react-router-dom';
import type { NavEntry } from '../../config/nav.ts';
import { PRODUCT_NAME } from '../../hooks/use-document-title.ts';
import { cn } from '../../utils/cn.ts';

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

const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  cn(
    'flex min-h-11 items-center rounded-stitch px-4 py-2 font-semibold no-underline',
    isActive ? 'bg-thread text-white hover:text-white' : 'text-thread hover:bg-linen-deep hover:text-thread',
  );

export function AppShell({ guildName, homeHref, nav, headerEnd, children }: AppShellProps) {
  const [menuOpen, setMenuOpen] = useState(false);
  const menuId = useId();
  const location = useLocation();

  // A chosen link has done its job: fold the phone menu away on every navigation.
  useEffect(() => setMenuOpen(false), [location.pathname]);

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href={`#${MAIN_ID}`}
        className="sr-only z-50 rounded-stitch bg-thread px-4 py-3 font-semibold text-white focus:not-sr-only focus:fixed focus:top-2 focus:left-2 hover:text-white"
      >
        Skip to main content
      </a>

      <header className="border-b-4 border-madder bg-linen-deep">
        <div className="mx-auto flex max-w-6xl items-center justify-between gap-3 px-4 py-3 sm:px-6">
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
                type="button"
                aria-expanded={menuOpen}
                aria-controls={menuId}
                onClick={() => setMenuOpen((open) => !open)}
                className="inline-flex min-h-11 min-w-11 items-center gap-2 rounded-stitch border-2 border-thread bg-muslin px-4 font-semibold md:hidden"
              >
                <span aria-hidden="true" className="text-xl leading-none">
                  {menuOpen ? '✕' : '☰'}
                </span>
                Menu
              </button>
            ) : null}
          </div>
        </div>
        {nav.length > 0 ? (
          <nav aria-label="Main" id={menuId} className={cn('border-t border-seam md:block', menuOpen ? 'block' : 'hidden')}>
            <ul className="mx-auto flex max-w-6xl flex-col gap-1 px-4 py-2 sm:px-6 md:flex-row md:flex-wrap">
              {nav.map((entry) => (
                <li key={entry.page.path}>
                  <NavLink to={entry.page.getHref()} end={entry.page.path === '/'} className={navLinkClass}>
                    {entry.label}
                    {entry.Count ? <entry.Count /> : null}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
        ) : null}
      </header>

      <main id={MAIN_ID} tabIndex={-1} className="flex-1 px-4 py-8 focus:outline-none sm:px-6 sm:py-10">
        {children}
      </main>

      <footer className="border-t-2 border-seam px-4 py-6 text-thread-soft sm:px-6">
        <p className="mx-auto max-w-6xl">
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

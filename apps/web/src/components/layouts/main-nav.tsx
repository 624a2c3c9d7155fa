import { useId, type KeyboardEvent } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { currentNavEntry, navGroups, type NavEntry } from '../../config/nav.ts';
import { cn } from '../../utils/cn.ts';

export interface MainNavProps {
  id: string;
  entries: readonly NavEntry[];
  /** Below the wide-screen breakpoint the menu folds behind the header's Menu button. */
  open: boolean;
  /** Escape inside the unfolded phone menu folds it away again. */
  onClose: () => void;
}

const linkClass = (current: boolean) =>
  cn(
    'flex min-h-11 items-center rounded-stitch px-3 py-2 font-semibold leading-tight no-underline',
    current ? 'bg-thread text-white hover:text-white' : 'text-thread hover:bg-linen-deep hover:text-thread',
  );

/**
 * The main menu as labelled sections (Exchange, Guild office, You), each a list
 * named by its heading. A sidebar where the shell (a size container) is at least
 * 60 rem wide; narrower — a phone, a tablet upright, or text enlarged to 200 % — the
 * same lists unfold under the header. The current page is marked `aria-current="page"`.
 */
export function MainNav({ id, entries, open, onClose }: MainNavProps) {
  const { pathname } = useLocation();
  const current = currentNavEntry(pathname, entries);
  const baseId = useId();

  const onKeyDown = (event: KeyboardEvent<HTMLElement>) => {
    if (event.key === 'Escape' && open) onClose();
  };

  return (
    <nav
      aria-label="Main"
      id={id}
      onKeyDown={onKeyDown}
      className={cn(
        'border-b-2 border-seam bg-muslin px-4 py-4 sm:px-6 print:hidden',
        '@min-[60rem]:block @min-[60rem]:w-60 @min-[60rem]:shrink-0 @min-[60rem]:border-r-2 @min-[60rem]:border-b-0 @min-[60rem]:bg-transparent @min-[60rem]:px-3 @min-[60rem]:py-8',
        open ? 'block' : 'hidden',
      )}
    >
      <div className="grid gap-x-6 gap-y-5 @min-[36rem]:grid-cols-2 @min-[60rem]:block @min-[60rem]:space-y-6">
        {navGroups(entries).map((group) => {
          const labelId = `${baseId}-${group.id}`;
          return (
            <div key={group.id} className="space-y-1">
              <p id={labelId} className="border-b border-seam px-3 pb-1 font-bold text-thread-soft">
                {group.label}
              </p>
              <ul aria-labelledby={labelId} className="space-y-1">
                {group.entries.map((entry) => {
                  const isCurrent = entry === current;
                  return (
                    <li key={entry.page.path}>
                      <Link to={entry.page.getHref()} aria-current={isCurrent ? 'page' : undefined} className={linkClass(isCurrent)}>
                        {entry.label}
                        {entry.Count ? <entry.Count /> : null}
                      </Link>
                    </li>
                  );
                })}
              </ul>
            </div>
          );
        })}
      </div>
    </nav>
  );
}

import { useId, type ReactNode } from 'react';
import { useDocumentTitle } from '../../hooks/use-document-title.ts';
import { cn } from '../../utils/cn.ts';

export interface PageProps {
  title: string;
  /** A sentence under the heading saying what the page is for. */
  intro?: ReactNode;
  /** "narrow" for single forms (sign-in, join), "wide" for tables. */
  width?: 'narrow' | 'regular' | 'wide';
  actions?: ReactNode;
  children: ReactNode;
}

const widths = { narrow: 'max-w-xl', regular: 'max-w-3xl', wide: 'max-w-6xl' } as const;

/** Every page's frame: one h1 (focused after navigation by the app shell), an intro, then content. */
export function Page({ title, intro, width = 'regular', actions, children }: PageProps) {
  useDocumentTitle(title);
  return (
    <div className={cn('mx-auto w-full space-y-6', widths[width])}>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="space-y-2">
          <h1 tabIndex={-1} data-page-heading="" className="text-3xl font-bold focus:outline-none sm:text-4xl">
            {title}
          </h1>
          {intro ? <div className="max-w-prose text-lg text-thread-soft">{intro}</div> : null}
        </div>
        {actions ? <div className="flex flex-wrap gap-3">{actions}</div> : null}
      </div>
      {children}
    </div>
  );
}

/** A bordered section; with a title it is a named region (landmark) headed by that title. */
export function Panel({ title, children, className }: { title?: ReactNode; children: ReactNode; className?: string }) {
  const headingId = useId();
  return (
    <section
      aria-labelledby={title ? headingId : undefined}
      className={cn('space-y-4 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt sm:p-6', className)}
    >
      {title ? (
        <h2 id={headingId} className="text-xl font-bold">
          {title}
        </h2>
      ) : null}
      {children}
    </section>
  );
}

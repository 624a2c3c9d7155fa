import type { ReactNode } from 'react';
import { paths } from '../config/paths.ts';
import { Panel } from './layouts/page.tsx';
import { ButtonLink } from './ui/button.tsx';

/** What an empty list of the member's own (basket, orders) says, and the way to the shelf where bundles are found. */
export function EmptyWithShelfLink({ children, otherLinks }: { children: ReactNode; otherLinks?: ReactNode }) {
  return (
    <Panel>
      {children}
      <div className="flex flex-wrap gap-3">
        <ButtonLink to={paths.app.shelf.getHref()} variant="secondary">
          Browse the shelf
        </ButtonLink>
        {otherLinks}
      </div>
    </Panel>
  );
}

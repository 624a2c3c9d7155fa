import { lazy, Suspense } from 'react';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { ShelfBrowser } from '../../../../features/shelf/components/shelf-browser.tsx';

const SaveWishPanel = lazy(() => import('../../../../features/wishes/components/save-wish-panel.tsx').then((m) => ({ default: m.SaveWishPanel })));
const NoMatchesWishNote = lazy(() => import('../../../../features/wishes/components/no-matches-wish-note.tsx').then((m) => ({ default: m.NoMatchesWishNote })));

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  if (!guild) throw new Error('The shelf opened before the session was read.');
  return (
    <Page
      title="The shelf"
      intro="Bundles your fellow members are passing on, each checked by the librarian. Filter for what you want to make."
      width="wide"
    >
      <ShelfBrowser
        units={user.units}
        currency={guild.currency}
        renderForFilters={(filters) => (
          <Suspense fallback={null}>
            <SaveWishPanel filters={filters} units={user.units} currency={guild.currency} />
          </Suspense>
        )}
        renderNoMatches={(filters) => (
          <Suspense fallback={<p>Try fewer filters.</p>}>
            <NoMatchesWishNote filters={filters} />
          </Suspense>
        )}
      />
    </Page>
  );
}

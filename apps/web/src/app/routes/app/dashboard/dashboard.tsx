import type { DashboardQuery } from '@scrap-relay/shared';
import { useSearchParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { PrintFrame } from '../../../../components/print-frame.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { DashboardView } from '../../../../features/dashboard/components/dashboard-view.tsx';
import { periodFromSearch, periodToSearch } from '../../../../features/dashboard/period.ts';

export function Component() {
  const user = useSessionUser();
  const [search, setSearch] = useSearchParams();
  const query = periodFromSearch(search);
  return (
    <PrintFrame>
      <Page
        title="Dashboard"
        intro={user.abilities.viewLedger ? 'What the exchange has done, with the guild’s money figures.' : 'What the guild’s exchange has done.'}
        width="wide"
      >
        <DashboardView query={query} onQueryChange={(next: DashboardQuery) => setSearch(periodToSearch(next))} units={user.units} />
      </Page>
    </PrintFrame>
  );
}

import { useSearchParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { PrintFrame } from '../../../../components/print-frame.tsx';
import { LibrarianReportView } from '../../../../features/dashboard/components/librarian-report-view.tsx';
import { periodFromSearch, periodToSearch } from '../../../../features/dashboard/period.ts';

export function Component() {
  const [search, setSearch] = useSearchParams();
  return (
    <PrintFrame>
      <Page title="Librarian report" intro="Reviews, the starter programme, and handovers at each meeting, for the period you choose.">
        <LibrarianReportView query={periodFromSearch(search)} onQueryChange={(next) => setSearch(periodToSearch(next))} />
      </Page>
    </PrintFrame>
  );
}

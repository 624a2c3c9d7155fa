import { ledgerQuerySchema, type LedgerQuery } from '@scrap-relay/shared';
import { useSearchParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { LedgerView } from '../../../../features/treasurer/components/ledger-view.tsx';

/** Filters live in the address (`?from=&to=&kind=`), so a filtered ledger can be bookmarked or shared with the auditor. */
export function Component() {
  const [search, setSearch] = useSearchParams();
  const parsed = ledgerQuerySchema.safeParse(Object.fromEntries([...search.entries()].filter(([key]) => ['from', 'to', 'kind'].includes(key))));
  const filters: LedgerQuery = parsed.success ? parsed.data : {};
  const change = (next: LedgerQuery) =>
    setSearch(Object.fromEntries(Object.entries(next).filter((entry): entry is [string, string] => Boolean(entry[1]))), { replace: true });
  return (
    <Page
      title="Ledger"
      width="wide"
      intro="Every movement of money through the guild’s card account. The lines of each transaction add up to zero: what a buyer pays is a minus on the buyers’ line, shared out as pluses to the seller, the guild and the card processor. Open an order from its reference to refund it. Fees and refunds follow the guild’s rules and local law."
    >
      <LedgerView filters={filters} onFiltersChange={change} />
    </Page>
  );
}

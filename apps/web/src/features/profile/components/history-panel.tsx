import { formatWeight, type UnitSystem } from '@scrap-relay/shared';
import { Panel } from '../../../components/layouts/page.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { useHistory } from '../api/get-history.ts';

/** What the member has passed on and received, in their units. */
export function HistoryPanel({ units }: { units: UnitSystem }) {
  const history = useHistory();
  return (
    <Panel title="Your part in the exchange">
      {history.isPending ? <Loading label="Loading your history…" /> : null}
      {history.isError ? <p role="alert">Your history could not be loaded: {history.error.message}</p> : null}
      {history.isSuccess ? (
        <dl className="grid gap-4 sm:grid-cols-3">
          <Item term="Bundles you rehomed" value={String(history.data.history.bundlesRehomed)} />
          <Item term="Fabric you passed on" value={formatWeight(history.data.history.gramsPassedOn, units)} />
          <Item
            term="Bundles you received"
            value={String(history.data.history.bundlesReceived)}
            detail={`${formatWeight(history.data.history.gramsReceived, units)} of fabric`}
          />
        </dl>
      ) : null}
    </Panel>
  );
}

function Item({ term, value, detail }: { term: string; value: string; detail?: string }) {
  return (
    <div className="rounded-stitch border-2 border-seam bg-linen p-4">
      <dt className="font-semibold text-thread-soft">{term}</dt>
      <dd className="text-3xl font-bold tabular-nums">{value}</dd>
      {detail ? <dd className="text-thread-soft">{detail}</dd> : null}
    </div>
  );
}

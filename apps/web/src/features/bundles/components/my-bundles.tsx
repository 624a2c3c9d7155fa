import { BUNDLE_STATE_LABELS, BUNDLE_STATES, formatWeight, type BundleState, type BundleView, type UnitSystem } from '@scrap-relay/shared';
import { useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useMyBundles } from '../api/get-my-bundles.ts';
import { offerSummary } from '../utils/bundle-text.ts';
import { BundleStateLabel } from './bundle-state-label.tsx';
import { SellerActions } from './seller-actions.tsx';

const column = dataTableColumns<BundleView>();

const stateOptions = [{ value: '', label: 'Every state' }, ...BUNDLE_STATES.map((state) => ({ value: state, label: BUNDLE_STATE_LABELS[state] }))];

/** The member's bundles in every state, with what each one's abilities allow; returned ones lead with the librarian's notes. */
export function MyBundles({ units }: { units: UnitSystem }) {
  const bundles = useMyBundles();
  const [state, setState] = useState<BundleState | ''>('');
  const stateId = useId();
  const timeZone = useGuildTimeZone();

  const columns = useMemo(
    () =>
      column.columns([
        column.display({
          id: 'photo',
          header: 'Photo',
          cell: ({ row }) => <Thumbnail bundle={row.original} />,
          meta: { cellClassName: 'md:w-28' },
        }),
        column.accessor('title', {
          header: 'Bundle',
          sortFn: 'text',
          cell: ({ row }) => <BundleSummary bundle={row.original} units={units} />,
          meta: { cellClassName: 'md:min-w-56' },
        }),
        column.accessor('state', {
          header: 'State',
          sortFn: 'text',
          filterFn: 'arrIncludes',
          cell: ({ row }) => <StateCell bundle={row.original} />,
        }),
        column.accessor('updatedAt', {
          header: 'Last changed',
          sortFn: 'text',
          sortDescFirst: true,
          meta: { sortLabels: ['Oldest first', 'Newest first'] },
          cell: ({ getValue }) => formatDate(getValue(), timeZone),
        }),
        column.display({
          id: 'actions',
          header: 'Actions',
          cell: ({ row }) => <SellerActions bundle={row.original} />,
          meta: { cellClassName: 'md:min-w-48' },
        }),
      ]),
    [units, timeZone],
  );
  // A bundle has one state; arrIncludes compares it with the chosen one.
  const columnFilters = useMemo(() => (state ? [{ id: 'state', value: [state] }] : []), [state]);

  if (bundles.isPending) return <Loading label="Loading your bundles…" />;
  if (bundles.isError) {
    return (
      <Alert tone="error" title="Your bundles could not be loaded">
        <p>{bundles.error.message}</p>
        <Button variant="secondary" onClick={() => bundles.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }

  const items = bundles.data.items;
  const returned = items.filter((bundle) => bundle.state === 'returned' && bundle.reviewNotes);
  if (items.length === 0) {
    return (
      <Panel>
        <p className="text-lg">You have not listed any bundles yet.</p>
        <ButtonLink to={paths.app.newBundle.getHref()}>List a bundle</ButtonLink>
      </Panel>
    );
  }

  return (
    <div className="space-y-6">
      {returned.length > 0 ? (
        <section aria-labelledby={`${stateId}-returned`} className="space-y-3">
          <h2 id={`${stateId}-returned`} className="text-xl font-bold">
            Sent back by the librarian
          </h2>
          <ul className="space-y-3">
            {returned.map((bundle) => (
              <li key={bundle.id}>
                <Alert tone="warning" announce={false} title={bundle.title || 'Untitled draft'}>
                  <blockquote className="border-l-4 border-ochre pl-3 text-lg whitespace-pre-line">{bundle.reviewNotes}</blockquote>
                  <ButtonLink to={paths.app.editBundle.getHref(bundle.id, 'review')} variant="secondary">
                    Fix and resubmit<span className="sr-only">: {bundle.title}</span>
                  </ButtonLink>
                </Alert>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <div role="search" aria-label="Filter your bundles" className="max-w-sm space-y-1.5">
        <label htmlFor={stateId} className="block font-semibold">
          State
        </label>
        <Select id={stateId} options={stateOptions} value={state} onChange={(event) => setState(event.target.value as BundleState | '')} />
      </div>

      <DataTable
        caption="Your bundles"
        data={items}
        columns={columns}
        getRowId={(bundle) => bundle.id}
        columnFilters={columnFilters}
        initialSorting={[{ id: 'updatedAt', desc: true }]}
        noun={['bundle', 'bundles']}
        emptyMessage="None of your bundles is in that state."
      />
    </div>
  );
}

function Thumbnail({ bundle }: { bundle: BundleView }) {
  const cover = bundle.photos[0];
  if (!cover) {
    return (
      <span className="flex size-20 items-center justify-center rounded-stitch border-2 border-dashed border-selvage text-center text-sm text-thread-soft">
        No photo
      </span>
    );
  }
  return <img src={cover.thumbUrl} alt={`Cover photo of ${bundle.title || 'the draft'}`} className="size-20 rounded-stitch object-cover" style={{ backgroundColor: cover.averageHex }} />;
}

function BundleSummary({ bundle, units }: { bundle: BundleView; units: UnitSystem }) {
  return (
    <div>
      <Link to={paths.app.bundle.getHref(bundle.id)} className="font-semibold">
        {bundle.title || 'Untitled draft'}
      </Link>
      <p className="text-thread-soft">{offerSummary(bundle)}</p>
      <p className="text-thread-soft">
        {bundle.weightGrams ? formatWeight(bundle.weightGrams, units) : 'Weight not given'}
        {bundle.quantity > 1 ? ` · ${bundle.quantityAvailable} of ${bundle.quantity} packs left` : ''}
      </p>
    </div>
  );
}

function StateCell({ bundle }: { bundle: BundleView }) {
  const timeZone = useGuildTimeZone();
  return (
    <div className="space-y-1">
      <BundleStateLabel state={bundle.state} offer={bundle.offer} />
      {bundle.state === 'on_shelf' && bundle.expiresAt ? <p className="text-thread-soft">Until {formatDate(bundle.expiresAt, timeZone)}</p> : null}
      {bundle.state === 'returned' && bundle.reviewNotes ? <p className="text-thread-soft">See the librarian’s note above.</p> : null}
    </div>
  );
}

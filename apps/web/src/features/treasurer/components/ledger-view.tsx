import { describeTimeZone, formatMoney, LEDGER_ENTRY_KINDS, type LedgerEntryView, type LedgerQuery, ledgerQuerySchema } from '@scrap-relay/shared';
import { useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, buttonClass } from '../../../components/ui/button.tsx';
import { FieldShell, Input, Select } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { cn } from '../../../utils/cn.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatCompactTimestamp } from '../../../utils/meetings.ts';
import { ledgerCsvHref, useLedger } from '../api/get-ledger.ts';
import { LEDGER_KIND_LABELS, ledgerDirection, ledgerKindText } from '../utils/labels.ts';
import { OpenDisputes } from './open-disputes.tsx';

const column = dataTableColumns<LedgerEntryView>();

const kindOptions = [{ value: '', label: 'Every kind' }, ...LEDGER_ENTRY_KINDS.map((kind) => ({ value: kind, label: LEDGER_KIND_LABELS[kind] }))];

const searchText = (entry: LedgerEntryView) => `${entry.accountLabel} ${entry.orderReference ?? ''} ${entry.transactionId}`;

/** The entries the table shows for this search (the same test the table applies), for the sum above it. */
const matching = (entries: readonly LedgerEntryView[], query: string) => {
  const wanted = query.trim().toLocaleLowerCase();
  return wanted ? entries.filter((entry) => searchText(entry).toLocaleLowerCase().includes(wanted)) : entries;
};

export interface LedgerViewProps {
  filters: LedgerQuery;
  onFiltersChange: (filters: LedgerQuery) => void;
}

/** Every money movement, filtered by date and kind on the server, searched and sorted in the browser, with the same set as CSV. */
export function LedgerView({ filters, onFiltersChange }: LedgerViewProps) {
  const ledger = useLedger(filters);
  const [query, setQuery] = useState('');
  const searchId = useId();
  const timeZone = useGuildTimeZone();

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('createdAt', {
          header: 'When',
          sortFn: 'text',
          sortDescFirst: true,
          meta: { sortLabels: ['Oldest first', 'Newest first'] },
          cell: ({ getValue }) => <time dateTime={getValue()}>{formatCompactTimestamp(getValue(), timeZone)}</time>,
        }),
        column.accessor('kind', {
          header: 'Kind',
          sortFn: 'text',
          cell: ({ row }) => ledgerKindText(row.original.kind, row.original.reverses),
        }),
        column.accessor('accountLabel', { header: 'Account', sortFn: 'text' }),
        column.accessor('amountMinor', {
          header: 'Amount, in or out',
          sortFn: (a, b) => a.original.amountMinor - b.original.amountMinor,
          meta: { sortLabels: ['Smallest first', 'Largest first'], cellClassName: 'md:text-right' },
          cell: ({ row }) => <Amount entry={row.original} />,
        }),
        column.accessor('orderReference', {
          header: 'Order',
          enableSorting: false,
          // The treasurer may open any order: this is the way to one to refund it or see its story.
          cell: ({ row }) => <OrderLink entry={row.original} />,
        }),
        column.accessor('transactionId', {
          header: 'Transaction',
          enableSorting: false,
          // Entries of one transaction share it (and sum to zero); the first characters are enough to see which go together.
          cell: ({ getValue }) => (
            <span title={getValue()} className="font-mono text-base">
              {getValue().slice(0, 8)}
            </span>
          ),
        }),
      ]),
    [timeZone],
  );

  return (
    <div className="space-y-6">
      <OpenDisputes />
      <LedgerFilters filters={filters} onChange={onFiltersChange} timeZone={timeZone} />

      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="min-w-64 flex-1 space-y-1.5 sm:max-w-md">
          <label htmlFor={searchId} className="block font-semibold">
            Search by account, order or transaction
          </label>
          <Input id={searchId} type="search" value={query} onChange={(event) => setQuery(event.target.value)} autoComplete="off" />
        </div>
        <a href={ledgerCsvHref(filters)} download className={buttonClass('secondary')}>
          Download these entries (CSV)
        </a>
      </div>

      {ledger.isPending ? <Loading label="Loading the ledger…" /> : null}
      {ledger.isError ? (
        <Alert tone="error" title="The ledger could not be loaded">
          <p>{ledger.error.message}</p>
          <Button variant="secondary" onClick={() => ledger.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {ledger.data ? (
        <div aria-busy={ledger.isPlaceholderData || undefined} className={cn(ledger.isPlaceholderData && 'opacity-60')}>
          <LedgerTotal entries={matching(ledger.data.items, query)} />
          <DataTable
            caption="Ledger entries"
            data={ledger.data.items}
            columns={columns}
            getRowId={(entry) => entry.id}
            globalFilter={query}
            searchText={searchText}
            initialSorting={[{ id: 'createdAt', desc: true }]}
            pageSize={50}
            noun={['entry', 'entries']}
            emptyMessage={query || filters.from || filters.to || filters.kind ? 'No entries match these filters.' : 'Nothing has been recorded yet.'}
          />
        </div>
      ) : null}
    </div>
  );
}

/** The signed amount (the entries of a transaction add up to zero) and what the sign means for this account. */
function Amount({ entry }: { entry: LedgerEntryView }) {
  return (
    <span className="block">
      <span className="block font-semibold tabular-nums">{formatMoney(entry.amountMinor, entry.currency)}</span>
      <span className="block text-base text-thread-soft">{ledgerDirection(entry.account, entry.amountMinor, entry.kind)}</span>
    </span>
  );
}

function OrderLink({ entry }: { entry: LedgerEntryView }) {
  if (!entry.orderId) return entry.orderReference ?? '—';
  return (
    <Link to={paths.app.order.getHref(entry.orderId)} className="inline-flex min-h-11 items-center font-semibold whitespace-nowrap">
      <span className="sr-only">Open order </span>
      {entry.orderReference ?? 'the order'}
    </Link>
  );
}

/** The sum of what the filters select: zero across whole transactions, the guild's income when only fees are shown. */
function LedgerTotal({ entries }: { entries: readonly LedgerEntryView[] }) {
  const currency = entries[0]?.currency;
  if (!currency) return null;
  const total = entries.reduce((sum, entry) => sum + entry.amountMinor, 0);
  return (
    <p className="mb-4">
      Sum of the {entries.length} {entries.length === 1 ? 'entry' : 'entries'} shown: <strong>{formatMoney(total, currency)}</strong>
    </p>
  );
}

/** The dates are days in the guild's time zone, as the API reads them: "30 November" ends at midnight there. */
function LedgerFilters({ filters, onChange, timeZone }: { filters: LedgerQuery; onChange: (filters: LedgerQuery) => void; timeZone: string }) {
  const reversed = filters.from && filters.to && filters.to < filters.from;
  const set = (patch: Partial<Record<keyof LedgerQuery, string>>) => {
    const next = { ...filters, ...patch };
    const parsed = ledgerQuerySchema.safeParse(Object.fromEntries(Object.entries(next).filter(([, value]) => value)));
    if (parsed.success) onChange(parsed.data);
  };
  return (
    <div role="search" aria-label="Filter the ledger" className="grid gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 sm:grid-cols-3">
      <FieldShell label="From" hint="First day included.">
        {(control) => <Input {...control} type="date" value={filters.from ?? ''} onChange={(event) => set({ from: event.target.value })} />}
      </FieldShell>
      <FieldShell label="To" hint="Last day included." error={reversed ? 'The last day comes before the first.' : undefined}>
        {(control) => <Input {...control} type="date" value={filters.to ?? ''} onChange={(event) => set({ to: event.target.value })} />}
      </FieldShell>
      <FieldShell label="Kind" hint="Payments, fees, refunds…">
        {(control) => <Select {...control} options={kindOptions} value={filters.kind ?? ''} onChange={(event) => set({ kind: event.target.value })} />}
      </FieldShell>
      <p className="text-thread-soft sm:col-span-3">Days run from midnight to midnight in the guild’s time zone, {describeTimeZone(timeZone)}, and so do the times below and in the CSV.</p>
    </div>
  );
}

import { formatMoney, payoutSchema, type SellerBalanceView } from '@scrap-relay/shared';
import { useMemo, useRef, useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { FieldShell, Select } from '../../../components/ui/field.tsx';
import { Form, ScaledNumberField, SelectField, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { majorTextToMinor, minorToMajorText } from '../../../utils/units.ts';
import { useSellerBalances } from '../api/get-seller-balances.ts';
import { useRecordPayout } from '../api/record-payout.ts';
import { PAYOUT_METHOD_LABELS } from '../utils/labels.ts';

const column = dataTableColumns<SellerBalanceView>();
const methodOptions = Object.entries(PAYOUT_METHOD_LABELS).map(([value, label]) => ({ value, label }));
type AmountKey = 'creditedMinor' | 'paidOutMinor' | 'payableMinor' | 'waitingMinor';
const byAmount = (key: AmountKey) => (a: { original: SellerBalanceView }, b: { original: SellerBalanceView }) => a.original[key] - b.original[key];
const amountMeta = { sortLabels: ['Smallest first', 'Largest first'], cellClassName: 'md:text-right tabular-nums' } as const;

interface Recorded {
  name: string;
  amountMinor: number;
  currency: string;
}

/**
 * What the guild owes each seller, split into what may be paid out now and what waits for bags not yet sent, and
 * recording a payout made outside Scrap Relay (at most the payable figure; it lowers it).
 */
export function SellerBalancesView() {
  const balances = useSellerBalances();
  const [sellerId, setSellerId] = useState('');
  const [recorded, setRecorded] = useState<Recorded | null>(null);
  const formRef = useRef<HTMLDivElement>(null);

  const choose = (id: string) => {
    setSellerId(id);
    setRecorded(null);
    formRef.current?.scrollIntoView?.({ block: 'start' });
    formRef.current?.querySelector<HTMLElement>('select')?.focus();
  };

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('name', { header: 'Seller', sortFn: 'text', cell: ({ getValue }) => <span className="font-semibold">{getValue()}</span> }),
        column.accessor('creditedMinor', {
          header: 'Credited',
          sortFn: byAmount('creditedMinor'),
          meta: amountMeta,
          cell: ({ row }) => formatMoney(row.original.creditedMinor, row.original.currency),
        }),
        column.accessor('paidOutMinor', {
          header: 'Paid out',
          sortFn: byAmount('paidOutMinor'),
          meta: amountMeta,
          cell: ({ row }) => formatMoney(row.original.paidOutMinor, row.original.currency),
        }),
        column.accessor('payableMinor', {
          header: 'Payable now',
          sortFn: byAmount('payableMinor'),
          sortDescFirst: true,
          meta: amountMeta,
          cell: ({ row }) => <strong>{formatMoney(row.original.payableMinor, row.original.currency)}</strong>,
        }),
        column.accessor('waitingMinor', {
          header: 'Waiting for bags to go out',
          sortFn: byAmount('waitingMinor'),
          sortDescFirst: true,
          meta: amountMeta,
          cell: ({ row }) => (
            <span className={row.original.waitingMinor === 0 ? 'text-thread-soft' : undefined}>{formatMoney(row.original.waitingMinor, row.original.currency)}</span>
          ),
        }),
        column.display({
          id: 'payout',
          header: 'Payout',
          cell: ({ row }) => {
            const { payableMinor, waitingMinor, currency, name, sellerId: id } = row.original;
            if (payableMinor > 0) {
              return (
                <Button variant="secondary" onClick={() => choose(id)}>
                  Record a payout<span className="sr-only"> to {name}</span>
                </Button>
              );
            }
            if (payableMinor < 0) return <span>Owes the guild {formatMoney(-payableMinor, currency)}, from a refund after a payout</span>;
            if (waitingMinor > 0) return <span className="text-thread-soft">Nothing to pay until the bags go out</span>;
            return <span className="text-thread-soft">Nothing owed</span>;
          },
        }),
      ]),
    [],
  );

  if (balances.isPending) return <Loading label="Loading seller balances…" />;
  if (balances.isError) {
    return (
      <Alert tone="error" title="The balances could not be loaded">
        <p>{balances.error.message}</p>
        <Button variant="secondary" onClick={() => balances.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }

  const items = balances.data.items;
  const payable = items.filter((item) => item.payableMinor > 0);
  const selected = payable.find((item) => item.sellerId === sellerId) ?? null;
  const currency = items[0]?.currency;
  const totalPayable = payable.reduce((sum, item) => sum + item.payableMinor, 0);
  const totalWaiting = items.reduce((sum, item) => sum + item.waitingMinor, 0);
  const totalOwed = totalPayable + totalWaiting;
  const owing = items.filter((item) => item.payableMinor < 0);
  const totalOwing = owing.reduce((sum, item) => sum - item.payableMinor, 0);

  return (
    <div className="space-y-6">
      {currency ? (
        <div className="space-y-2">
          <p className="text-lg">
            The guild owes sellers <strong>{formatMoney(totalOwed, currency)}</strong> in all:{' '}
            <strong>{formatMoney(totalPayable, currency)}</strong> can be paid out now
            {totalWaiting > 0 ? (
              <>
                , and <strong>{formatMoney(totalWaiting, currency)}</strong> is waiting for bags to go out
              </>
            ) : null}
            .
          </p>
          {owing.length > 0 ? (
            <p>
              {owing.length === 1 ? `${owing[0]!.name} owes` : `${owing.length} sellers owe`} the guild{' '}
              <strong>{formatMoney(totalOwing, currency)}</strong>: a refund came after they were paid out. It comes off their next sales,
              so the month statement’s total owed to sellers, which nets it off, is {formatMoney(totalOwed - totalOwing, currency)}.
            </p>
          ) : null}
          <p className="text-thread-soft">
            A sale’s credit can be paid out once its bag has gone out: when the seller marks the parcel posted, or the bag is ticked off as handed
            over at a meeting. Until then the order can still be cancelled and refunded, so its credit waits.
          </p>
        </div>
      ) : null}
      <DataTable
        caption="Seller balances"
        data={items}
        columns={columns}
        getRowId={(item) => item.sellerId}
        initialSorting={[{ id: 'payableMinor', desc: true }]}
        noun={['seller', 'sellers']}
        emptyMessage="No seller has been credited yet."
      />

      <div ref={formRef} className="scroll-mt-4">
        <Panel title="Record a payout">
          <p>
            Record money you have already paid a seller (by transfer, cheque or cash), up to what is payable now. It is written to the ledger and
            lowers what the guild owes them. Payouts follow the guild’s own rules and local law.
          </p>
          {recorded ? (
            <Alert tone="success" title={`Payout of ${formatMoney(recorded.amountMinor, recorded.currency)} to ${recorded.name} recorded`}>
              <p>The balance above is updated, and the ledger has the entry.</p>
            </Alert>
          ) : null}
          {payable.length === 0 ? (
            <p className="font-semibold">{totalWaiting > 0 ? 'Nothing can be paid out until bags go out.' : 'No seller is owed anything just now.'}</p>
          ) : (
            <>
              <FieldShell label="Seller">
                {(control) => (
                  <Select
                    {...control}
                    className="max-w-md"
                    value={selected?.sellerId ?? ''}
                    onChange={(event) => choose(event.target.value)}
                    options={[
                      { value: '', label: 'Choose a seller' },
                      ...payable.map((item) => ({ value: item.sellerId, label: `${item.name} (${formatMoney(item.payableMinor, item.currency)})` })),
                    ]}
                  />
                )}
              </FieldShell>
              {selected ? (
                <PayoutForm
                  key={selected.sellerId}
                  seller={selected}
                  onRecorded={(done) => {
                    setRecorded(done);
                    setSellerId('');
                  }}
                />
              ) : null}
            </>
          )}
        </Panel>
      </div>
    </div>
  );
}

function PayoutForm({ seller, onRecorded }: { seller: SellerBalanceView; onRecorded: (recorded: Recorded) => void }) {
  const record = useRecordPayout();
  const money = (minor: number) => formatMoney(minor, seller.currency);
  const waiting = seller.waitingMinor > 0 ? ` ${money(seller.waitingMinor)} more is waiting for bags not yet posted or handed over.` : '';
  return (
    <Form
      schema={payoutSchema}
      defaultValues={{ sellerId: seller.sellerId, amountMinor: seller.payableMinor, method: 'bank_transfer', reference: '' }}
      messages={{ amountMinor: `Enter an amount between ${money(1)} and what is payable now.` }}
      onSubmit={async (values) => {
        const { payout } = await record.mutateAsync(values);
        onRecorded({ name: seller.name, amountMinor: payout.amountMinor, currency: payout.currency });
      }}
    >
      <ScaledNumberField
        name="amountMinor"
        label={`Amount paid (${seller.currency})`}
        hint={`At most ${money(seller.payableMinor)}, what can be paid to ${seller.name} now.${waiting}`}
        toText={(minor) => minorToMajorText(minor, seller.currency)}
        fromText={(text) => majorTextToMinor(text, seller.currency)}
      />
      <SelectField name="method" label="How it was paid" options={methodOptions} />
      <TextField name="reference" label="Reference (optional)" hint="A cheque number or transfer reference, for the books." autoComplete="off" />
      <SubmitButton pendingLabel="Recording…">Record the payout</SubmitButton>
    </Form>
  );
}

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
const byAmount = (key: 'creditedMinor' | 'paidOutMinor' | 'balanceMinor') => (a: { original: SellerBalanceView }, b: { original: SellerBalanceView }) =>
  a.original[key] - b.original[key];

interface Recorded {
  name: string;
  amountMinor: number;
  currency: string;
}

/** What the guild owes each seller, and recording a payout made outside Scrap Relay (it reduces the balance). */
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
          meta: { sortLabels: ['Smallest first', 'Largest first'], cellClassName: 'md:text-right tabular-nums' },
          cell: ({ row }) => formatMoney(row.original.creditedMinor, row.original.currency),
        }),
        column.accessor('paidOutMinor', {
          header: 'Paid out',
          sortFn: byAmount('paidOutMinor'),
          meta: { sortLabels: ['Smallest first', 'Largest first'], cellClassName: 'md:text-right tabular-nums' },
          cell: ({ row }) => formatMoney(row.original.paidOutMinor, row.original.currency),
        }),
        column.accessor('balanceMinor', {
          header: 'Owed now',
          sortFn: byAmount('balanceMinor'),
          sortDescFirst: true,
          meta: { sortLabels: ['Smallest first', 'Largest first'], cellClassName: 'md:text-right tabular-nums' },
          cell: ({ row }) => <strong>{formatMoney(row.original.balanceMinor, row.original.currency)}</strong>,
        }),
        column.display({
          id: 'payout',
          header: 'Payout',
          cell: ({ row }) =>
            row.original.balanceMinor > 0 ? (
              <Button variant="secondary" onClick={() => choose(row.original.sellerId)}>
                Record a payout<span className="sr-only"> to {row.original.name}</span>
              </Button>
            ) : row.original.balanceMinor < 0 ? (
              <span>Owes the guild {formatMoney(-row.original.balanceMinor, row.original.currency)}, from a refund after a payout</span>
            ) : (
              <span className="text-thread-soft">Nothing owed</span>
            ),
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
  const owed = items.filter((item) => item.balanceMinor > 0);
  const selected = items.find((item) => item.sellerId === sellerId) ?? null;
  const currency = items[0]?.currency;
  const totalOwed = owed.reduce((sum, item) => sum + item.balanceMinor, 0);
  const owing = items.filter((item) => item.balanceMinor < 0);
  const totalOwing = owing.reduce((sum, item) => sum - item.balanceMinor, 0);

  return (
    <div className="space-y-6">
      {currency ? (
        <div className="space-y-2">
          <p className="text-lg">
            The guild owes sellers <strong>{formatMoney(totalOwed, currency)}</strong> in all.
          </p>
          {owing.length > 0 ? (
            <p>
              {owing.length === 1 ? `${owing[0]!.name} owes` : `${owing.length} sellers owe`} the guild{' '}
              <strong>{formatMoney(totalOwing, currency)}</strong>: a refund came after they were paid out. It comes off their next sales,
              so the month statement’s total owed to sellers, which nets it off, is {formatMoney(totalOwed - totalOwing, currency)}.
            </p>
          ) : null}
        </div>
      ) : null}
      <DataTable
        caption="Seller balances"
        data={items}
        columns={columns}
        getRowId={(item) => item.sellerId}
        initialSorting={[{ id: 'balanceMinor', desc: true }]}
        noun={['seller', 'sellers']}
        emptyMessage="No seller has been credited yet."
      />

      <div ref={formRef} className="scroll-mt-4">
        <Panel title="Record a payout">
          <p>
            Record money you have already paid a seller (by transfer, cheque or cash). It is written to the ledger and lowers what the guild owes
            them.
          </p>
          {recorded ? (
            <Alert tone="success" title={`Payout of ${formatMoney(recorded.amountMinor, recorded.currency)} to ${recorded.name} recorded`}>
              <p>The balance above is updated, and the ledger has the entry.</p>
            </Alert>
          ) : null}
          {owed.length === 0 ? (
            <p className="font-semibold">No seller is owed anything just now.</p>
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
                      ...owed.map((item) => ({ value: item.sellerId, label: `${item.name} (owed ${formatMoney(item.balanceMinor, item.currency)})` })),
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
  return (
    <Form
      schema={payoutSchema}
      defaultValues={{ sellerId: seller.sellerId, amountMinor: seller.balanceMinor, method: 'bank_transfer', reference: '' }}
      messages={{ amountMinor: `Enter an amount between ${formatMoney(1, seller.currency)} and what is owed.` }}
      onSubmit={async (values) => {
        const { payout } = await record.mutateAsync(values);
        onRecorded({ name: seller.name, amountMinor: payout.amountMinor, currency: payout.currency });
      }}
    >
      <ScaledNumberField
        name="amountMinor"
        label={`Amount paid (${seller.currency})`}
        hint={`At most ${formatMoney(seller.balanceMinor, seller.currency)}, what the guild owes ${seller.name}.`}
        toText={(minor) => minorToMajorText(minor, seller.currency)}
        fromText={(text) => majorTextToMinor(text, seller.currency)}
      />
      <SelectField name="method" label="How it was paid" options={methodOptions} />
      <TextField name="reference" label="Reference (optional)" hint="A cheque number or transfer reference, for the books." autoComplete="off" />
      <SubmitButton pendingLabel="Recording…">Record the payout</SubmitButton>
    </Form>
  );
}

import { describeTimeZone, formatMoney, statementQuerySchema, type MonthStatement } from '@scrap-relay/shared';
import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, buttonClass } from '../../../components/ui/button.tsx';
import { FieldShell, Input } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useStatement } from '../api/get-statement.ts';
import { csvHref, formatMonth, guildMonthOf } from '../period.ts';

export interface StatementViewProps {
  month: string;
  onMonthChange: (month: string) => void;
  guildName: string;
}

/** The month-end statement: totals from the ledger, closing seller balances, print and CSV. */
export function StatementView({ month, onMonthChange, guildName }: StatementViewProps) {
  const statement = useStatement(month);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4 print:hidden">
        <MonthPicker key={month} month={month} onChange={onMonthChange} />
        <div className="flex flex-wrap gap-3">
          <a href={csvHref('/api/reports/statement.csv', new URLSearchParams({ month }))} download className={buttonClass('secondary')}>
            Download CSV
          </a>
          <Button variant="secondary" onClick={() => window.print()}>
            Print the statement
          </Button>
        </div>
      </div>
      {statement.isPending ? <Loading label="Loading the statement…" /> : null}
      {statement.isError ? (
        <Alert tone="error" title="The statement could not be loaded">
          <p>{statement.error.message}</p>
          <Button variant="secondary" onClick={() => statement.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {statement.isSuccess ? <Statement statement={statement.data.statement} guildName={guildName} /> : null}
    </div>
  );
}

function MonthPicker({ month, onChange }: { month: string; onChange: (month: string) => void }) {
  const [draft, setDraft] = useState(month);
  const [error, setError] = useState<string | undefined>();
  const timeZone = useGuildTimeZone();
  const show = () => {
    const parsed = statementQuerySchema.safeParse({ month: draft });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Choose a month.');
      return;
    }
    setError(undefined);
    onChange(parsed.data.month);
  };
  return (
    <form
      className="flex flex-wrap items-end gap-3 rounded-stitch border-2 border-seam bg-muslin p-4"
      onSubmit={(event) => {
        event.preventDefault();
        show();
      }}
    >
      <FieldShell label="Month" hint={`Months run from midnight to midnight in the guild’s time zone, ${describeTimeZone(timeZone)}.`} error={error} className="w-full sm:w-72">
        {(control) => <Input {...control} type="month" value={draft} max={guildMonthOf(new Date(), timeZone)} placeholder="2026-03" onChange={(event) => setDraft(event.target.value)} />}
      </FieldShell>
      <Button type="submit">Show the statement</Button>
    </form>
  );
}

function Statement({ statement: s, guildName }: { statement: MonthStatement; guildName: string }) {
  const money = (minor: number) => formatMoney(minor, s.currency);
  const timeZone = useGuildTimeZone();
  const inProgress = s.month === guildMonthOf(new Date(), timeZone);
  const lines: Array<[string, number, string]> = [
    ['Card payments received', s.chargesMinor, 'Everything buyers paid: prices and postage.'],
    ['Refunds to buyers', s.refundsMinor, 'Paid back on cancelled or refunded orders.'],
    ['Guild fees kept', s.guildFeesMinor, 'The guild’s fees, less fees given back with refunds and disputes lost.'],
    ['Card processing cost', s.processingCostMinor, 'What the card processor kept.'],
    ['Taken back by buyers’ banks', s.disputesLostMinor, 'Disputes the guild lost: payments the card processor returned to the buyer’s card.'],
    ['Dispute fees', s.disputeFeesMinor, 'What the card processor charged for handling disputes, less fees it gave back.'],
    ['Credited to sellers', s.sellerCreditsMinor, 'Sellers’ shares and postage, less refunds and disputes lost.'],
    ['Paid out to sellers', s.payoutsMinor, 'Payouts the treasurer recorded.'],
  ];
  return (
    <div className="space-y-6">
      <Panel title={`Statement for ${formatMonth(s.month)}`}>
        <p>
          {guildName} · amounts in {s.currency}
          {inProgress ? ' · this month so far' : ''} · prepared {formatDate(new Date().toISOString(), timeZone)}
        </p>
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Money through the guild’s account in {formatMonth(s.month)}</caption>
          <thead>
            <tr className="border-b-2 border-thread print:border-black">
              <th scope="col" className="py-2 pr-4">Line</th>
              <th scope="col" className="py-2 text-right">Amount</th>
            </tr>
          </thead>
          <tbody>
            {lines.map(([label, amount, note]) => (
              <tr key={label} className="border-b border-seam print:border-black">
                <th scope="row" className="py-2 pr-4 text-left align-top">
                  <span className="block font-semibold">{label}</span>
                  <span className="block font-normal text-thread-soft">{note}</span>
                </th>
                <td className="py-2 text-right align-top text-lg tabular-nums">{money(amount)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Panel>

      <Panel title={`What the guild owes sellers at the end of ${formatMonth(s.month)}`} className="break-inside-avoid">
        {s.closingBalances.length === 0 ? (
          <p>No seller is owed anything.</p>
        ) : (
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Closing seller balances</caption>
            <thead>
              <tr className="border-b-2 border-thread print:border-black">
                <th scope="col" className="py-2 pr-4">Seller</th>
                <th scope="col" className="py-2 text-right">Balance</th>
              </tr>
            </thead>
            <tbody>
              {s.closingBalances.map((b) => (
                <tr key={b.sellerId} className="border-b border-seam print:border-black">
                  <th scope="row" className="py-2 pr-4 text-left font-semibold">
                    {b.name}
                  </th>
                  <td className="py-2 text-right tabular-nums">{money(b.balanceMinor)}</td>
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr className="border-t-2 border-thread print:border-black">
                <th scope="row" className="py-2 pr-4 text-left font-bold">
                  Total owed to sellers
                </th>
                <td className="py-2 text-right text-lg font-bold tabular-nums">{money(s.closingBalancesTotalMinor)}</td>
              </tr>
            </tfoot>
          </table>
        )}
      </Panel>
      <p className="text-thread-soft">
        Every figure is the sum of the ledger’s entries dated in the month in the guild’s time zone, {describeTimeZone(timeZone)}, the same days the
        ledger filters by; the balances add up every seller’s entries to the month’s end. The
        guild is the merchant: fees and refunds follow the guild’s own rules and local law.
      </p>
    </div>
  );
}

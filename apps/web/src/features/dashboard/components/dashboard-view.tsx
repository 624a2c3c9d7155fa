import { describeTimeZone, formatMoney, formatWeight, OFFER_LABELS, type DashboardFigures, type DashboardQuery, type Offer, type UnitSystem } from '@scrap-relay/shared';
import { lazy, Suspense, type ReactNode } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, buttonClass } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { formatCalendarDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useDashboard } from '../api/get-dashboard.ts';
import { formatHours } from '../chart-data.ts';
import { csvHref, formatMonth, periodToSearch } from '../period.ts';
import { PeriodPicker } from './period-picker.tsx';

const DashboardCharts = lazy(() => import('./dashboard-charts.tsx'));

/** The period in words for the heading of the figures. */
export function periodTitle(query: DashboardQuery, figures: DashboardFigures): string {
  if (query.period === 'all') return 'All time';
  if (query.period === 'year') return `The year ${figures.period.label}`;
  if (query.period === 'month') return formatMonth(figures.period.label);
  return `${formatCalendarDate(query.from ?? '')} to ${formatCalendarDate(query.to ?? '')}`;
}

export interface DashboardViewProps {
  query: DashboardQuery;
  onQueryChange: (query: DashboardQuery) => void;
  units: UnitSystem;
}

/** What the exchange has done in a period: the figures (money only for officers), the charts, and the CSV. */
export function DashboardView({ query, onQueryChange, units }: DashboardViewProps) {
  const dashboard = useDashboard(query);
  const timeZone = useGuildTimeZone();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4 print:hidden">
        <PeriodPicker key={`${query.period}-${query.from ?? ''}-${query.to ?? ''}`} value={query} onChange={onQueryChange} />
        <div className="flex flex-wrap gap-3">
          <a href={csvHref('/api/dashboard.csv', periodToSearch(query))} download className={buttonClass('secondary')}>
            Download CSV
          </a>
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
        </div>
      </div>
      <p className="text-thread-soft">Days, months and years run from midnight to midnight in the guild’s time zone, {describeTimeZone(timeZone)}.</p>
      {dashboard.isPending ? <Loading label="Loading the figures…" /> : null}
      {dashboard.isError ? (
        <Alert tone="error" title="The figures could not be loaded">
          <p>{dashboard.error.message}</p>
          <Button variant="secondary" onClick={() => dashboard.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {dashboard.isSuccess ? (
        <>
          <Figures title={periodTitle(query, dashboard.data.figures)} figures={dashboard.data.figures} units={units} busy={dashboard.isPlaceholderData} />
          <section aria-labelledby="dashboard-charts" className="space-y-4 print:break-before-page">
            <h2 id="dashboard-charts" className="text-2xl font-bold">
              Charts
            </h2>
            <Suspense fallback={<Loading label="Loading the charts…" />}>
              <DashboardCharts charts={dashboard.data.figures.charts} units={units} />
            </Suspense>
          </section>
        </>
      ) : null}
    </div>
  );
}

function Figures({ title, figures, units, busy }: { title: string; figures: DashboardFigures; units: UnitSystem; busy: boolean }) {
  const rehomed = figures.bundlesRehomedByOffer.reduce((sum, row) => sum + row.units, 0);
  const money = figures.money;
  return (
    <Panel title={title} className={busy ? 'opacity-60' : undefined}>
      <dl className="grid grid-cols-2 gap-3 sm:gap-4 lg:grid-cols-3">
        <Figure term="Weight rehomed" value={formatWeight(figures.weightRehomedGrams, units)} />
        <Figure
          term="Bundles rehomed"
          value={String(rehomed)}
          detail={
            figures.bundlesRehomedByOffer.length > 0
              ? figures.bundlesRehomedByOffer.map((row) => `${OFFER_LABELS[row.offer as Offer] ?? row.offer}: ${row.units}`).join(' · ')
              : undefined
          }
        />
        <Figure term="New quilters served" value={String(figures.newQuiltersServed)} detail="With a starter bundle." />
        <Figure term="Waiting for review" value={String(figures.waitingForReview)} detail="Right now." />
        <Figure
          term="Median review time"
          value={figures.medianReviewHours === null ? 'No reviews' : formatHours(figures.medianReviewHours)}
          detail="From submitting to the librarian’s decision."
        />
        <Figure term="Bundles expired" value={String(figures.bundlesExpired)} detail="Left the shelf unclaimed." />
      </dl>
      {money ? (
        <>
          <h3 className="pt-2 text-lg font-bold">Money</h3>
          <dl className="grid grid-cols-2 gap-3 sm:gap-4 lg:grid-cols-3">
            <Figure term="Funds raised" value={formatMoney(money.fundsRaisedMinor, money.currency)} detail="Guild fees less card costs and dispute fees." />
            <Figure term="Guild fees" value={formatMoney(money.guildFeesMinor, money.currency)} detail="After refunds and disputes lost." />
            <Figure term="Card costs" value={formatMoney(money.processingCostMinor, money.currency)} detail="The card processor’s fees, kept even on refunds." />
            {money.disputeFeesMinor !== 0 ? (
              <Figure term="Dispute fees" value={formatMoney(money.disputeFeesMinor, money.currency)} detail="The card processor’s fees for handling disputes." />
            ) : null}
            <Figure term="Credited to sellers" value={formatMoney(money.sellerCreditsMinor, money.currency)} />
            <Figure term="Paid out to sellers" value={formatMoney(money.payoutsMinor, money.currency)} />
            <Figure term="Postage paid by buyers" value={formatMoney(money.postagePaidMinor, money.currency)} />
            <Figure term="Refunds" value={formatMoney(money.refundsMinor, money.currency)} />
            {money.disputesLostMinor !== 0 ? (
              <Figure term="Taken back by buyers’ banks" value={formatMoney(money.disputesLostMinor, money.currency)} detail="Card payments returned in disputes the guild lost." />
            ) : null}
          </dl>
        </>
      ) : null}
    </Panel>
  );
}

function Figure({ term, value, detail }: { term: string; value: string; detail?: ReactNode }) {
  return (
    <div className="rounded-stitch border-2 border-seam bg-linen p-3 sm:p-4 print:border-black">
      <dt className="font-semibold text-thread-soft">{term}</dt>
      <dd className="text-2xl font-bold tabular-nums sm:text-3xl">{value}</dd>
      {detail ? <dd className="text-thread-soft">{detail}</dd> : null}
    </div>
  );
}

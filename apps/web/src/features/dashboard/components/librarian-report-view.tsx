import type { DashboardQuery } from '@scrap-relay/shared';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { formatDateTime } from '../../../utils/meetings.ts';
import { useLibrarianReport } from '../api/get-librarian-report.ts';
import type { LibrarianReport } from '../types.ts';
import { PeriodPicker } from './period-picker.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

/** The librarian's report for a period: review decisions, the starter programme, and handovers per meeting. */
export function LibrarianReportView({ query, onQueryChange }: { query: DashboardQuery; onQueryChange: (query: DashboardQuery) => void }) {
  const report = useLibrarianReport(query);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4 print:hidden">
        <PeriodPicker key={`${query.period}-${query.from ?? ''}-${query.to ?? ''}`} value={query} onChange={onQueryChange} />
        <Button variant="secondary" onClick={() => window.print()}>
          Print
        </Button>
      </div>
      {report.isPending ? <Loading label="Loading the report…" /> : null}
      {report.isError ? (
        <Alert tone="error" title="The report could not be loaded">
          <p>{report.error.message}</p>
          <Button variant="secondary" onClick={() => report.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {report.isSuccess ? <Report report={report.data.report} /> : null}
    </div>
  );
}

function Stat({ term, value }: { term: string; value: string }) {
  return (
    <div className="rounded-stitch border-2 border-seam bg-linen p-4 print:border-black">
      <dt className="font-semibold text-thread-soft">{term}</dt>
      <dd className="text-3xl font-bold tabular-nums">{value}</dd>
    </div>
  );
}

function Report({ report }: { report: LibrarianReport }) {
  const timeZone = useGuildTimeZone();
  const { review, starter, handovers } = report;
  return (
    <>
      <Panel title="Reviewing listings">
        <dl className="grid gap-4 sm:grid-cols-2">
          <Stat term="Approved" value={String(review.approved)} />
          <Stat term="Returned to the seller" value={String(review.returned)} />
        </dl>
        <h3 className="text-lg font-bold">Most common notes on returned listings</h3>
        {review.commonReturnNotes.length === 0 ? (
          <p>No listing was returned with notes in this period.</p>
        ) : (
          <ol className="list-decimal space-y-1 pl-6">
            {review.commonReturnNotes.map((note) => (
              <li key={note.notes}>
                “{note.notes}” — {note.times === 1 ? 'once' : `${note.times} times`}
              </li>
            ))}
          </ol>
        )}
      </Panel>

      <Panel title="Starter programme">
        <dl className="grid gap-4 sm:grid-cols-3">
          <Stat term="Starter bundles claimed" value={String(starter.claims)} />
          <Stat term="Waiting now" value={String(starter.waitingNow)} />
          <Stat
            term="Median wait"
            value={starter.medianWaitDays === null ? 'No offers taken' : `${starter.medianWaitDays} ${starter.medianWaitDays === 1 ? 'day' : 'days'}`}
          />
        </dl>
        <p className="text-thread-soft">The wait runs from joining the list to accepting an offer.</p>
      </Panel>

      <Panel title="Handovers per meeting" className="break-inside-avoid">
        {handovers.length === 0 ? (
          <p>No meeting in this period.</p>
        ) : (
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Handovers done and missed at each meeting</caption>
            <thead>
              <tr className="border-b-2 border-thread print:border-black">
                <th scope="col" className="py-2 pr-4">Meeting</th>
                <th scope="col" className="py-2 pr-4 text-right">Handed over</th>
                <th scope="col" className="py-2 pr-4 text-right">Missed</th>
                <th scope="col" className="py-2 text-right">Still due</th>
              </tr>
            </thead>
            <tbody>
              {handovers.map((h) => (
                <tr key={h.meetingId} className="border-b border-seam print:border-black">
                  <th scope="row" className="py-2 pr-4 text-left align-top">
                    <span className="block font-semibold">{formatDateTime(h.startsAt, timeZone)}</span>
                    <span className="block font-normal text-thread-soft">{h.place}</span>
                  </th>
                  <td className="py-2 pr-4 text-right align-top tabular-nums">{h.done}</td>
                  <td className="py-2 pr-4 text-right align-top tabular-nums">{h.missed}</td>
                  <td className="py-2 text-right align-top tabular-nums">{h.due}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    </>
  );
}

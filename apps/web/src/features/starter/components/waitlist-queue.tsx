import { waitlistRemovalSchema } from '@scrap-relay/shared';
import { useMemo, useState } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { FieldShell, Input } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { formatDateTime } from '../../../utils/meetings.ts';
import { formatDate } from '../../../utils/format.ts';
import { useWaitlist } from '../api/get-waitlist.ts';
import { useRemoveWaitlistEntry } from '../api/remove-waitlist-entry.ts';
import type { WaitlistRow } from '@scrap-relay/shared';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

const column = dataTableColumns<WaitlistRow>();

/** The librarian's queue: everyone waiting, in the order they asked, with any open offer and its deadline. */
export function WaitlistQueue() {
  const timeZone = useGuildTimeZone();
  const waitlist = useWaitlist();
  const [removing, setRemoving] = useState<WaitlistRow | null>(null);
  const [removed, setRemoved] = useState<string | null>(null);

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('position', {
          header: 'Place',
          sortFn: 'alphanumeric',
          meta: { sortLabels: ['Front of the queue first', 'Back of the queue first'] },
          cell: ({ getValue }) => <span className="text-lg font-bold">{getValue()}</span>,
        }),
        column.accessor('name', { header: 'Name', sortFn: 'text', cell: ({ getValue }) => <span className="font-semibold">{getValue()}</span> }),
        column.accessor('joinedAt', { header: 'Joined the list', sortFn: 'text', cell: ({ getValue }) => formatDate(getValue(), timeZone) }),
        column.accessor('waitingDays', {
          header: 'Waiting',
          sortFn: 'alphanumeric',
          meta: { sortLabels: ['Shortest wait first', 'Longest wait first'] },
          cell: ({ getValue }) => (getValue() === 1 ? '1 day' : `${getValue()} days`),
        }),
        column.display({
          id: 'offer',
          header: 'Open offer',
          cell: ({ row }) =>
            row.original.offer ? (
              <span>
                “{row.original.offer.bundleTitle}”, answer due by {formatDateTime(row.original.offer.expiresAt, timeZone)}
              </span>
            ) : (
              <span className="text-thread-soft">None yet</span>
            ),
        }),
        column.display({
          id: 'remove',
          header: 'Remove',
          cell: ({ row }) => (
            <Button variant="secondary" onClick={() => setRemoving(row.original)}>
              Remove<span className="sr-only"> {row.original.name}</span>
            </Button>
          ),
        }),
      ]),
    [timeZone],
  );

  if (waitlist.isPending) return <Loading label="Loading the waiting list…" />;
  if (waitlist.isError) {
    return (
      <Alert tone="error" title="The waiting list could not be loaded">
        <p>{waitlist.error.message}</p>
        <Button variant="secondary" onClick={() => waitlist.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }

  return (
    <div className="space-y-4">
      {removed ? <Alert tone="success" title={`${removed} has been taken off the waiting list`} /> : null}
      <DataTable
        caption="Starter programme waiting list, in queue order"
        data={waitlist.data.items}
        columns={columns}
        getRowId={(row) => row.id}
        initialSorting={[{ id: 'position', desc: false }]}
        pageSize={50}
        noun={['person waiting', 'people waiting']}
        emptyMessage="Nobody is waiting. New quilters join the list when no starter bundle is free."
      />
      {removing ? (
        <RemoveDialog
          row={removing}
          onClose={() => setRemoving(null)}
          onRemoved={(name) => {
            setRemoving(null);
            setRemoved(name);
          }}
        />
      ) : null}
    </div>
  );
}

function RemoveDialog({ row, onClose, onRemoved }: { row: WaitlistRow; onClose: () => void; onRemoved: (name: string) => void }) {
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const remove = useRemoveWaitlistEntry({ onSuccess: () => onRemoved(row.name) });

  const confirm = () => {
    const parsed = waitlistRemovalSchema.safeParse({ reason });
    if (!parsed.success) {
      setReasonError(parsed.error.issues[0]?.message ?? 'Give a reason.');
      return;
    }
    setReasonError(undefined);
    remove.mutate({ entryId: row.id, data: parsed.data });
  };

  return (
    <ConfirmDialog
      open
      title={`Take ${row.name} off the waiting list?`}
      confirmLabel="Remove from the list"
      pendingLabel="Removing…"
      confirmVariant="danger"
      isPending={remove.isPending}
      onCancel={onClose}
      onConfirm={confirm}
    >
      <p>
        They lose their place (number {row.position}).{row.offer ? ' The bundle offered to them goes to the next person in line.' : ''} They get an
        e-mail with the reason, and it is kept with the guild’s records.
      </p>
      <FieldShell label="Reason" hint="For example: moved away, asked to be taken off." error={reasonError ?? remove.error?.fields.reason}>
        {(control) => <Input {...control} value={reason} maxLength={300} onChange={(event) => setReason(event.target.value)} />}
      </FieldShell>
      {remove.isError && !remove.error.fields.reason ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {remove.error.message}
        </p>
      ) : null}
    </ConfirmDialog>
  );
}

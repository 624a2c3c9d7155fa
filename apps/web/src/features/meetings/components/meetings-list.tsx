import type { MeetingView } from '@scrap-relay/shared';
import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { useMeetings, type MeetingsWhen } from '../../../lib/meetings.ts';
import { cn } from '../../../utils/cn.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatDateTime, meetingHasStarted } from '../../../utils/meetings.ts';
import { useCreateMeeting } from '../api/create-meeting.ts';
import { useUpdateMeeting } from '../api/update-meeting.ts';
import { MeetingForm } from './meeting-form.tsx';

export interface MeetingsListProps {
  /** May add meetings (librarians and admins); editing each meeting follows its own `abilities.edit`. */
  canCreate: boolean;
}

/** The guild's meetings: the coming ones for everyone; officers add, edit and open each handover sheet. */
export function MeetingsList({ canCreate }: MeetingsListProps) {
  const [when, setWhen] = useState<MeetingsWhen>('upcoming');
  const meetings = useMeetings(when);
  const [saved, setSaved] = useState<string | null>(null);
  const timeZone = useGuildTimeZone();

  return (
    <div className="space-y-6">
      {canCreate ? <AddMeeting onAdded={(meeting) => setSaved(`Meeting added: ${formatDateTime(meeting.startsAt, timeZone)}, ${meeting.place}.`)} /> : null}
      {saved ? <Alert tone="success" title={saved} /> : null}

      <div role="group" aria-label="Which meetings to show" className="flex flex-wrap gap-2">
        {(
          [
            ['upcoming', 'Coming meetings'],
            ['all', 'All meetings, past included'],
          ] as const
        ).map(([value, label]) => (
          <Button key={value} variant={when === value ? 'primary' : 'secondary'} aria-pressed={when === value} onClick={() => setWhen(value)}>
            {label}
          </Button>
        ))}
      </div>

      {meetings.isPending ? <Loading label="Loading meetings…" /> : null}
      {meetings.isError ? (
        <Alert tone="error" title="The meetings could not be loaded">
          <p>{meetings.error.message}</p>
          <Button variant="secondary" onClick={() => meetings.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {meetings.isSuccess ? (
        meetings.data.items.length === 0 ? (
          <p className="text-lg">{when === 'upcoming' ? 'No meeting is set yet. The guild’s officers add them here.' : 'The guild has no meetings yet.'}</p>
        ) : (
          <ul className="space-y-4" aria-label={when === 'upcoming' ? 'Coming meetings' : 'All meetings'}>
            {meetings.data.items.map((meeting) => (
              <MeetingItem key={meeting.id} meeting={meeting} timeZone={timeZone} onSaved={setSaved} />
            ))}
          </ul>
        )
      ) : null}
    </div>
  );
}

function AddMeeting({ onAdded }: { onAdded: (meeting: MeetingView) => void }) {
  const [open, setOpen] = useState(false);
  const create = useCreateMeeting();
  if (!open) {
    return (
      <Button onClick={() => setOpen(true)}>
        Add a meeting
      </Button>
    );
  }
  return (
    <Panel title="Add a meeting">
      <MeetingForm
        submitLabel="Add the meeting"
        onCancel={() => setOpen(false)}
        onSubmit={async (values) => {
          const { meeting } = await create.mutateAsync(values);
          setOpen(false);
          onAdded(meeting);
        }}
      />
    </Panel>
  );
}

function MeetingItem({ meeting, timeZone, onSaved }: { meeting: MeetingView; timeZone: string; onSaved: (message: string) => void }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateMeeting();
  const past = meetingHasStarted(meeting);
  return (
    <li className={cn('space-y-3 rounded-stitch border-2 bg-muslin p-4 shadow-quilt sm:p-6', past ? 'border-seam' : 'border-thread-soft')}>
      <div className="space-y-1">
        <h2 className="text-xl font-bold">{formatDateTime(meeting.startsAt, timeZone)}</h2>
        <p className="text-lg">{meeting.place}</p>
        {past ? <p className="font-semibold text-thread-soft">This meeting has taken place.</p> : null}
        {meeting.notes ? <p className="whitespace-pre-line text-thread-soft">{meeting.notes}</p> : null}
      </div>
      {meeting.abilities.edit ? (
        editing ? (
          <MeetingForm
            meeting={meeting}
            submitLabel="Save changes"
            onCancel={() => setEditing(false)}
            onSubmit={async (values) => {
              const { meeting: saved } = await update.mutateAsync({ meetingId: meeting.id, data: values });
              setEditing(false);
              onSaved(`Meeting saved: ${formatDateTime(saved.startsAt, timeZone)}, ${saved.place}.`);
            }}
          />
        ) : (
          <div className="flex flex-wrap gap-3">
            <ButtonLink to={paths.app.handoverSheet.getHref(meeting.id)}>Handover sheet</ButtonLink>
            <Button variant="secondary" onClick={() => setEditing(true)}>
              Edit<span className="sr-only"> the meeting on {formatDateTime(meeting.startsAt, timeZone)}</span>
            </Button>
          </div>
        )
      ) : null}
    </li>
  );
}

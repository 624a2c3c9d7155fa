import type { MeetingView } from '@scrap-relay/shared';
import { MeetingSelect } from '../../../components/meeting-select.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { useMeetings } from '../../../lib/meetings.ts';

/**
 * Where the member will collect: one of the coming meetings, the next one chosen to begin with and named by its
 * date (not as "The next meeting" above the same meeting again). Left as it is, nothing is sent and the API picks
 * that same next meeting.
 */
export function MeetingChoice({ value, onChange, error }: { value: string; onChange: (meetingId: string) => void; error?: string | undefined }) {
  const meetings = useMeetings('upcoming');
  if (meetings.isPending) return <Loading label="Loading the coming meetings…" />;
  const items: MeetingView[] = meetings.data?.items ?? [];
  if (items.length === 0) {
    return <p>No guild meeting is set yet. You can still claim it: it is held for you, and we will e-mail you the date and place as soon as the guild sets its next meeting.</p>;
  }
  return (
    <MeetingSelect
      label="Collect it at"
      hint="Bundles change hands at the door of a guild meeting: the next one, unless you choose a later one."
      meetings={items}
      value={value || items[0]!.id}
      onChange={onChange}
      error={error}
    />
  );
}

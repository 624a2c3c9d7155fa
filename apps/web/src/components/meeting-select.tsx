import type { MeetingView } from '@scrap-relay/shared';
import { FieldShell, Select } from './ui/field.tsx';
import { meetingLabel } from '../utils/meetings.ts';
import { useGuildTimeZone } from '../utils/guild-session.ts';

export interface MeetingSelectProps {
  label: string;
  hint?: string;
  meetings: readonly MeetingView[];
  value: string;
  onChange: (meetingId: string) => void;
  /** A first choice with no meeting id, e.g. "The next meeting" (the API then picks the soonest). */
  emptyLabel?: string;
  error?: string | undefined;
  disabled?: boolean;
}

/** Choose one of the guild's meetings, named by when and where (in the guild's time zone, named). */
export function MeetingSelect({ label, hint, meetings, value, onChange, emptyLabel, error, disabled }: MeetingSelectProps) {
  const timeZone = useGuildTimeZone();
  const options = [...(emptyLabel ? [{ value: '', label: emptyLabel }] : []), ...meetings.map((m) => ({ value: m.id, label: meetingLabel(m, timeZone) }))];
  return (
    <FieldShell label={label} hint={hint} error={error}>
      {(control) => <Select {...control} options={options} value={value} disabled={disabled} onChange={(event) => onChange(event.target.value)} />}
    </FieldShell>
  );
}

import { describeTimeZone, type MeetingInput, type MeetingView } from '@scrap-relay/shared';
import { useMemo } from 'react';
import { get, useFormContext, useFormState, type FieldError } from 'react-hook-form';
import { Button } from '../../../components/ui/button.tsx';
import { controlClass, FieldShell } from '../../../components/ui/field.tsx';
import { Form, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { isoToLocalInput } from '../../../utils/meetings.ts';
import { meetingFormSchemaFor, type MeetingFormValues } from '../meeting-form-schema.ts';

export interface MeetingFormProps {
  /** The meeting being edited; a new one when absent. */
  meeting?: MeetingView;
  submitLabel: string;
  onSubmit: (values: MeetingInput) => Promise<unknown>;
  onCancel?: () => void;
}

/** Date and time (the guild's local time, in its time zone), place and notes for a guild meeting. */
export function MeetingForm({ meeting, submitLabel, onSubmit, onCancel }: MeetingFormProps) {
  const timeZone = useGuildTimeZone();
  const schema = useMemo(() => meetingFormSchemaFor(timeZone), [timeZone]);
  const defaultValues: MeetingFormValues = meeting
    ? { startsAt: isoToLocalInput(meeting.startsAt, timeZone), place: meeting.place, notes: meeting.notes }
    : { startsAt: '', place: '', notes: '' };
  return (
    <Form schema={schema} defaultValues={defaultValues} onSubmit={(values) => onSubmit(values)} className="space-y-5">
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField name="startsAt" label="Date and start time" hint={`In the guild’s time zone: ${describeTimeZone(timeZone)}.`} type="datetime-local" required />
        <TextField name="place" label="Place" hint="Where members bring and collect bundles." autoComplete="off" required />
      </div>
      <NotesField />
      {meeting ? <p className="text-thread-soft">Members who bring or collect a bundle at this meeting get an e-mail when you change its date, time or place.</p> : null}
      <div className="flex flex-wrap gap-3">
        <SubmitButton pendingLabel="Saving…">{submitLabel}</SubmitButton>
        {onCancel ? (
          <Button variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </Form>
  );
}

/** Notes for the meeting (what to bring, which door), several lines long. */
function NotesField() {
  const { register } = useFormContext<MeetingFormValues>();
  const { errors } = useFormState<MeetingFormValues>({ name: 'notes' });
  const error = (get(errors, 'notes') as FieldError | undefined)?.message;
  return (
    <FieldShell label="Notes (optional)" hint="For example: bring bundles in a labelled bag; use the side door." error={error}>
      {(control) => <textarea {...control} rows={3} maxLength={1000} className={controlClass} {...register('notes')} />}
    </FieldShell>
  );
}

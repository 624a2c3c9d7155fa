import { reviewDecisionSchema, type Offer, type ReviewDecisionInput } from '@scrap-relay/shared';
import { useFormContext, useFormState } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button.tsx';
import { controlClass, FieldShell } from '../../../components/ui/field.tsx';
import { Form } from '../../../components/ui/form.tsx';
import { useDecideReview } from '../api/decide-review.ts';

export interface ReviewOutcome {
  decision: ReviewDecisionInput['decision'];
  title: string;
  /** A starter bundle goes to the waiting list, not onto the shelf for everyone: the message after approval says so. */
  offer?: Offer | null;
}

type DecisionFormValues = z.input<typeof reviewDecisionSchema>;

export interface ReviewDecisionFormProps {
  bundleId: string;
  title: string;
  offer?: Offer | null;
  onDecided: (outcome: ReviewOutcome) => void;
}

/**
 * Notes and two buttons. Returning needs notes (the schema says so, and the seller
 * reads them in the e-mail); approving may carry a note the seller sees on the bundle.
 */
export function ReviewDecisionForm({ bundleId, title, offer = null, onDecided }: ReviewDecisionFormProps) {
  const decide = useDecideReview();
  return (
    <Form<DecisionFormValues, ReviewDecisionInput>
      schema={reviewDecisionSchema}
      defaultValues={{ decision: 'approve', notes: '' }}
      onSubmit={async (input) => {
        // An empty note on approval is no note at all.
        const data = input.notes ? input : { decision: input.decision };
        await decide.mutateAsync({ bundleId, data });
        onDecided({ decision: input.decision, title, offer });
      }}
      className="space-y-4"
    >
      <NotesField />
      <DecisionButtons offer={offer} />
    </Form>
  );
}

function NotesField() {
  const { register } = useFormContext<DecisionFormValues>();
  const { errors } = useFormState<DecisionFormValues>({ name: 'notes' });
  const error = typeof errors.notes?.message === 'string' ? errors.notes.message : undefined;
  return (
    <FieldShell
      label="Notes for the member"
      hint="Needed when you return a bundle: say what to change (a clearer photo, the weight, a missing disclosure). They are sent by e-mail."
      error={error}
    >
      {(control) => <textarea {...control} rows={5} className={`${controlClass} min-h-32`} {...register('notes')} />}
    </FieldShell>
  );
}

/** Starter bundles never go on the shelf: approving one offers it to the waiting list. */
function DecisionButtons({ offer }: { offer: Offer | null }) {
  const { setValue, watch } = useFormContext<DecisionFormValues>();
  const { isSubmitting } = useFormState<DecisionFormValues>();
  const decision = watch('decision');
  // Both are submit buttons; the one pressed sets the decision just before the form validates.
  const choose = (value: ReviewDecisionInput['decision']) => () => setValue('decision', value);
  return (
    <div className="flex flex-col gap-3 sm:flex-row sm:flex-wrap">
      <Button type="submit" onClick={choose('approve')} disabled={isSubmitting} isPending={isSubmitting && decision === 'approve'} pendingLabel="Approving…">
        {offer === 'starter' ? 'Approve: offer it to new quilters' : 'Approve: put it on the shelf'}
      </Button>
      <Button
        type="submit"
        variant="secondary"
        onClick={choose('return')}
        disabled={isSubmitting}
        isPending={isSubmitting && decision === 'return'}
        pendingLabel="Returning…"
      >
        Return with notes
      </Button>
    </div>
  );
}

import type { BundleView } from '@scrap-relay/shared';
import { useState } from 'react';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { useClaimStarterBundle } from '../api/claim-starter-bundle.ts';
import type { StarterClaimResult } from '../types.ts';
import { MeetingChoice } from './meeting-choice.tsx';

export interface ClaimDialogProps {
  bundle: BundleView;
  onClaimed: (result: StarterClaimResult, bundle: BundleView) => void;
  /** Someone else was quicker (409): the page says so and offers the waiting list. */
  onTaken: () => void;
  onClose: () => void;
}

export function ClaimDialog({ bundle, onClaimed, onTaken, onClose }: ClaimDialogProps) {
  const [meetingId, setMeetingId] = useState('');
  const claim = useClaimStarterBundle({
    onSuccess: (result) => onClaimed(result, bundle),
    onError: (error) => {
      if (error.status === 409) onTaken();
    },
  });
  const problem = claim.isError && claim.error.status !== 409 ? claim.error : null;
  return (
    <ConfirmDialog
      open
      title={`Claim “${bundle.title}”?`}
      confirmLabel="Claim it"
      pendingLabel="Claiming…"
      isPending={claim.isPending}
      onCancel={onClose}
      onConfirm={() => claim.mutate({ bundleId: bundle.id, data: meetingId ? { meetingId } : {} })}
    >
      <p>It is free. It counts as your starter bundle for the guild’s limit.</p>
      <MeetingChoice value={meetingId} onChange={setMeetingId} error={problem?.fields.meetingId} />
      {problem ? (
        <p role="alert" className="font-semibold text-madder-deep">
          <span aria-hidden="true">✗ </span>
          {problem.message}
        </p>
      ) : null}
    </ConfirmDialog>
  );
}

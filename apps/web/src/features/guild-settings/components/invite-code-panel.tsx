import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { useInviteCode } from '../api/get-invite-code.ts';
import { useRotateInviteCode } from '../api/rotate-invite-code.ts';

export function InviteCodePanel() {
  const inviteCode = useInviteCode();
  const [confirming, setConfirming] = useState(false);
  const rotate = useRotateInviteCode({ onSuccess: () => setConfirming(false) });

  return (
    <Panel title="Invite code">
      <p>New members type this code when they join. Share it the way your guild shares news: at a meeting or in the newsletter.</p>
      {inviteCode.isPending ? <Loading label="Loading the invite code…" /> : null}
      {inviteCode.isError ? (
        <Alert tone="error">
          <p>{inviteCode.error.message}</p>
        </Alert>
      ) : null}
      {inviteCode.isSuccess ? (
        <p className="inline-block rounded-stitch border-2 border-dashed border-thread bg-linen px-4 py-2 font-mono text-2xl font-bold tracking-wider break-all">
          {inviteCode.data.inviteCode}
        </p>
      ) : null}
      {rotate.isSuccess ? (
        <Alert tone="success" title="New invite code made">
          <p>The old code no longer works. Share the new one with the people you want to invite.</p>
        </Alert>
      ) : null}
      <div>
        <Button variant="secondary" onClick={() => setConfirming(true)} disabled={!inviteCode.isSuccess}>
          Make a new code
        </Button>
      </div>
      <ConfirmDialog
        open={confirming}
        title="Make a new invite code?"
        confirmLabel="Make a new code"
        pendingLabel="Making a new code…"
        isPending={rotate.isPending}
        onCancel={() => {
          rotate.reset();
          setConfirming(false);
        }}
        onConfirm={() => rotate.mutate()}
      >
        <p>The current code stops working at once. Members who have already joined are not affected.</p>
        {rotate.isError ? (
          <p role="alert" className="font-semibold text-madder-deep">
            {rotate.error.message}
          </p>
        ) : null}
      </ConfirmDialog>
    </Panel>
  );
}

import { closeAccountSchema } from '@scrap-relay/shared';
import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { FieldShell, Input } from '../../../components/ui/field.tsx';
import { useCloseAccount } from '../api/close-account.ts';

/**
 * Closing the account: personal data removed or anonymised, money records kept for the
 * guild's books. The password confirms it; orders still under way must finish first.
 */
export function CloseAccountPanel({ onClosed }: { onClosed: () => void }) {
  const [open, setOpen] = useState(false);
  const [closed, setClosed] = useState(false);
  if (closed) {
    return (
      <Alert tone="success" title="Your account is closed">
        <p>Thank you for passing your fabric on. Your personal details have been removed; you have been signed out.</p>
        <Button onClick={onClosed}>Leave Scrap Relay</Button>
      </Alert>
    );
  }
  return (
    <Panel title="Close your account">
      <ul className="list-disc space-y-2 pl-6">
        <li>Your name, e-mail address, postal address, wishes and place on the waiting list are removed or replaced, and your listings are withdrawn.</li>
        <li>Money records — orders, payments, fees, refunds and payouts — are kept for the guild’s books, without your personal details.</li>
        <li>Orders still under way (unpaid, paid or posted) must be received or cancelled first.</li>
      </ul>
      <Button variant="danger" onClick={() => setOpen(true)}>
        Close my account
      </Button>
      {open ? (
        <CloseDialog
          onCancel={() => setOpen(false)}
          onClosed={() => {
            setOpen(false);
            setClosed(true);
          }}
        />
      ) : null}
    </Panel>
  );
}

function CloseDialog({ onCancel, onClosed }: { onCancel: () => void; onClosed: () => void }) {
  const [password, setPassword] = useState('');
  const [error, setError] = useState<string | undefined>();
  const close = useCloseAccount({ onSuccess: onClosed });
  const problem =
    close.error?.status === 401 || close.error?.code === 'invalid_credentials'
      ? { field: 'That password is not right.' }
      : close.error
        ? { alert: close.error.message }
        : null;

  const confirm = () => {
    const parsed = closeAccountSchema.safeParse({ password });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setError(undefined);
    close.mutate(parsed.data);
  };

  return (
    <ConfirmDialog
      open
      title="Close your account for good?"
      confirmLabel="Close my account"
      pendingLabel="Closing…"
      cancelLabel="Keep my account"
      confirmVariant="danger"
      isPending={close.isPending}
      onCancel={onCancel}
      onConfirm={confirm}
    >
      <p>
        This cannot be undone. Your personal data is removed or anonymised; the money records of your orders stay in the guild’s books, as the guild’s
        accounts and local law require.
      </p>
      <FieldShell label="Your password, to confirm" error={error ?? problem?.field}>
        {(control) => (
          <Input {...control} type="password" autoComplete="current-password" value={password} onChange={(event) => setPassword(event.target.value)} />
        )}
      </FieldShell>
      {problem?.alert ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {problem.alert}
        </p>
      ) : null}
    </ConfirmDialog>
  );
}

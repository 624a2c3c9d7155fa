import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { useResendVerification } from '../api/resend-verification.ts';

export function ResendVerificationButton({ email, label = 'Send a new link' }: { email: string; label?: string }) {
  const resend = useResendVerification();
  return (
    <div className="space-y-3">
      <Button variant="secondary" onClick={() => resend.mutate()} isPending={resend.isPending} pendingLabel="Sending…">
        {label}
      </Button>
      {resend.isSuccess ? (
        <Alert tone="success">
          <p>
            We sent a new link to <strong>{email}</strong>. It can take a few minutes; look in your spam folder too.
          </p>
        </Alert>
      ) : null}
      {resend.isError ? (
        <Alert tone="error">
          <p>{resend.error.message}</p>
        </Alert>
      ) : null}
    </div>
  );
}

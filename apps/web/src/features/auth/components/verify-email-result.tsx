import { useEffect, useRef } from 'react';
import type { SessionUser } from '@scrap-relay/shared';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { useVerifyEmail } from '../api/verify-email.ts';
import { ResendVerificationButton } from './resend-verification-button.tsx';

/** Posts the e-mailed token once on arrival and says how it went. */
export function VerifyEmailResult({ token, signedInUser }: { token: string; signedInUser: SessionUser | null }) {
  const verify = useVerifyEmail();
  const sent = useRef(false);
  const { mutate } = verify;

  useEffect(() => {
    // Tokens work once: never post twice, even when React re-runs effects in development.
    if (sent.current) return;
    sent.current = true;
    mutate({ token });
  }, [mutate, token]);

  if (verify.isSuccess) {
    const { user } = verify.data;
    return (
      <div className="space-y-6">
        <Alert tone="success" title="Your e-mail address is confirmed">
          <p>
            Thank you, {user.name}. We will write to <strong>{user.email}</strong> about your bundles and orders.
          </p>
        </Alert>
        {signedInUser ? (
          <ButtonLink to={paths.app.home.getHref()}>Go to your home page</ButtonLink>
        ) : (
          <ButtonLink to={paths.auth.signIn.getHref()}>Sign in</ButtonLink>
        )}
      </div>
    );
  }

  if (verify.isError) {
    const expired = verify.error.code === 'invalid_token';
    // The link opened again after it worked: for a signed-in member who is confirmed, nothing is wrong.
    if (expired && signedInUser?.emailVerified) {
      return (
        <div className="space-y-6">
          <Alert tone="success" title="Your e-mail address is already confirmed">
            <p>
              We write to <strong>{signedInUser.email}</strong> about your bundles and orders. You do not need this link any more.
            </p>
          </Alert>
          <ButtonLink to={paths.app.home.getHref()}>Go to your home page</ButtonLink>
        </div>
      );
    }
    return (
      <div className="space-y-6">
        <Alert tone="error" title={expired ? 'This link has been used or has expired' : verify.error.message}>
          {expired ? <p>Confirmation links work once and only for a limited time.</p> : null}
        </Alert>
        {signedInUser && !signedInUser.emailVerified ? (
          <ResendVerificationButton email={signedInUser.email} />
        ) : signedInUser ? (
          <ButtonLink to={paths.app.home.getHref()}>Go to your home page</ButtonLink>
        ) : (
          <div className="space-y-3">
            <p>Sign in, and ask for a new link from your home page.</p>
            <ButtonLink to={paths.auth.signIn.getHref()} variant="secondary">
              Sign in
            </ButtonLink>
          </div>
        )}
      </div>
    );
  }

  return <Loading label="Confirming your e-mail address…" />;
}

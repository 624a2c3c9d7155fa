import { tokenSchema } from '@scrap-relay/shared';
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { ResetPasswordForm } from '../../../features/auth/components/reset-password-form.tsx';

/** Landing page for the e-mailed link `/reset-password?token=…`. */
export function Component() {
  const [search] = useSearchParams();
  const parsed = tokenSchema.safeParse({ token: search.get('token') ?? '' });
  const [done, setDone] = useState(false);

  if (done) {
    return (
      <Page title="Your password is changed" width="narrow">
        <Alert tone="success" title="You can now sign in with your new password." />
        <ButtonLink to={paths.auth.signIn.getHref()}>Sign in</ButtonLink>
      </Page>
    );
  }

  return (
    <Page title="Choose a new password" width="narrow">
      {parsed.success ? (
        <Panel>
          <ResetPasswordForm token={parsed.data.token} onDone={() => setDone(true)} />
        </Panel>
      ) : (
        <Alert tone="error" title="This link is incomplete">
          <p>
            Open the link straight from the e-mail, or{' '}
            <Link to={paths.auth.forgotPassword.getHref()}>ask for a new link</Link>.
          </p>
        </Alert>
      )}
    </Page>
  );
}

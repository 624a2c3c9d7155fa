import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { useSessionUser } from '../../../features/auth/api/get-session.ts';
import { ResendVerificationButton } from '../../../features/auth/components/resend-verification-button.tsx';

export function Component() {
  const user = useSessionUser();
  if (user.emailVerified) {
    return (
      <Page title="Your e-mail address is confirmed" width="narrow">
        <ButtonLink to={paths.app.home.getHref()}>Go to your home page</ButtonLink>
      </Page>
    );
  }
  return (
    <Page title="Check your e-mail" width="narrow">
      <Alert tone="success" title={`Welcome, ${user.name}. Your account is ready.`} announce={false}>
        <p>
          We sent a link to <strong>{user.email}</strong>. Open it to confirm that the address is yours. It can take a few
          minutes to arrive; look in your spam or junk folder too.
        </p>
      </Alert>
      <Panel title="No e-mail?">
        <p>Check the address above is right. If it is, we can send the link again.</p>
        <ResendVerificationButton email={user.email} />
      </Panel>
      <ButtonLink to={paths.app.home.getHref()} variant="secondary">
        Continue to your home page
      </ButtonLink>
    </Page>
  );
}

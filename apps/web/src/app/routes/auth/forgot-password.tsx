import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { ForgotPasswordForm } from '../../../features/auth/components/forgot-password-form.tsx';

export function Component() {
  return (
    <Page title="Forgotten your password?" intro="Tell us your e-mail address and we will send you a link to choose a new one." width="narrow">
      <Panel>
        <ForgotPasswordForm />
      </Panel>
      <p>
        <Link to={paths.auth.signIn.getHref()}>Back to sign in</Link>
      </p>
    </Page>
  );
}

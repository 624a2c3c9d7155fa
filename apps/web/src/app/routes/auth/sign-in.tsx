import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { SignInForm } from '../../../features/auth/components/sign-in-form.tsx';

export function Component() {
  return (
    <Page title="Sign in" intro="Sign in to pass on scraps, find fabric and see what the guild is sharing." width="narrow">
      <Panel>
        <SignInForm />
      </Panel>
      <ul className="space-y-3">
        <li>
          <Link to={paths.auth.forgotPassword.getHref()}>Forgotten your password?</Link>
        </li>
        <li>
          New to the exchange? <Link to={paths.auth.join.getHref()}>Join with your guild’s invite code</Link>
        </li>
      </ul>
    </Page>
  );
}

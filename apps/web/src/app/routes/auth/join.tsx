import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { JoinForm } from '../../../features/auth/components/join-form.tsx';

export function Component() {
  return (
    <Page
      title="Join the exchange"
      intro="Members of the guild join with the guild’s invite code. After joining, we send you an e-mail to confirm your address."
      width="narrow"
    >
      <Panel>
        <JoinForm />
      </Panel>
      <p>
        Already a member? <Link to={paths.auth.signIn.getHref()}>Sign in</Link>
      </p>
    </Page>
  );
}

import { tokenSchema } from '@scrap-relay/shared';
import { useSearchParams } from 'react-router-dom';
import { Page } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { useSession } from '../../../features/auth/api/get-session.ts';
import { VerifyEmailResult } from '../../../features/auth/components/verify-email-result.tsx';

/** Landing page for the e-mailed link `/verify-email?token=…`; works signed in or not. */
export function Component() {
  const [search] = useSearchParams();
  const parsed = tokenSchema.safeParse({ token: search.get('token') ?? '' });
  const user = useSession().data?.user ?? null;
  return (
    <Page title="Confirm your e-mail address" width="narrow">
      {parsed.success ? (
        <VerifyEmailResult token={parsed.data.token} signedInUser={user} />
      ) : (
        <Alert tone="error" title="This link is incomplete">
          <p>Open the link straight from the e-mail, or copy the whole of it into the address bar.</p>
        </Alert>
      )}
    </Page>
  );
}

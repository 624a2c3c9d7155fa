import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { SessionResponse } from '@scrap-relay/shared';
import { Page, Panel } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { Button } from '../../../../components/ui/button.tsx';
import { Loading } from '../../../../components/ui/loading.tsx';
import { PostalAddressPanel } from '../../../../features/account/components/postal-address-panel.tsx';
import { sessionQueryKey, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { useProfile } from '../../../../features/profile/api/get-profile.ts';
import { CloseAccountPanel } from '../../../../features/profile/components/close-account-panel.tsx';
import { DataExportPanel } from '../../../../features/profile/components/data-export-panel.tsx';
import { HistoryPanel } from '../../../../features/profile/components/history-panel.tsx';
import { ProfileForm } from '../../../../features/profile/components/profile-form.tsx';

/** After closing the account the session is gone: forget everything cached and let the guard send the visitor to sign in. */
function forgetMember(queryClient: QueryClient) {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionQueryKey[0] });
  queryClient.setQueryData<SessionResponse>(sessionQueryKey, (old) => (old ? { ...old, user: null } : old));
  void queryClient.invalidateQueries({ queryKey: sessionQueryKey });
}

export function Component() {
  const user = useSessionUser();
  const profile = useProfile();
  const queryClient = useQueryClient();
  return (
    <Page title="Your profile" intro="How you appear to other members, which units you read, which e-mails you get, where bundles are posted to you — and your own data.">
      {profile.isPending ? <Loading label="Loading your profile…" /> : null}
      {profile.isError ? (
        <Alert tone="error" title="Your profile could not be loaded">
          <p>{profile.error.message}</p>
          <Button variant="secondary" onClick={() => profile.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {profile.isSuccess ? (
        <Panel title="Your details">
          <p>
            Signed in as <strong className="break-all">{profile.data.profile.email}</strong>.
          </p>
          <ProfileForm
            profile={profile.data.profile}
            currentUnits={user.units}
            // The header shows the name, and every page formats weights and lengths in the session's units.
            onSaved={() => queryClient.invalidateQueries({ queryKey: sessionQueryKey })}
          />
        </Panel>
      ) : null}
      <PostalAddressPanel />
      <HistoryPanel units={user.units} />
      <DataExportPanel />
      <CloseAccountPanel onClosed={() => forgetMember(queryClient)} />
    </Page>
  );
}

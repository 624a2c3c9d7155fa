import { ROLES } from '@scrap-relay/shared';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { PostalAddressPanel } from '../../../features/account/components/postal-address-panel.tsx';
import { useSessionUser } from '../../../features/auth/api/get-session.ts';
import { SignOutButton } from '../../../features/auth/components/sign-out-button.tsx';
import { formatRoles } from '../../../utils/format.ts';

export function Component() {
  const user = useSessionUser();
  return (
    <Page title="Your account">
      <Panel title="Signed in as">
        <dl className="grid gap-x-6 sm:grid-cols-[12rem_1fr] sm:gap-y-3 max-sm:[&>dd]:mb-3">
          <dt className="font-semibold text-thread-soft">Name</dt>
          <dd>{user.name}</dd>
          <dt className="font-semibold text-thread-soft">E-mail</dt>
          <dd className="break-all">{user.email}</dd>
          <dt className="font-semibold text-thread-soft">Roles</dt>
          <dd>{formatRoles(user.roles, ROLES)}</dd>
          <dt className="font-semibold text-thread-soft">Units</dt>
          <dd>{user.units === 'metric' ? 'Centimetres, metres and grams' : 'Inches, yards and ounces'}</dd>
        </dl>
      </Panel>
      <PostalAddressPanel />
      <Panel title="Sign out">
        <p>On a shared tablet or computer, sign out when you have finished.</p>
        <SignOutButton />
      </Panel>
    </Page>
  );
}

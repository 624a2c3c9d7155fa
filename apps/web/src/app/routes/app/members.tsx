import { Page } from '../../../components/layouts/page.tsx';
import { MembersTable } from '../../../features/members/components/members-table.tsx';

export function Component() {
  return (
    <Page title="Members" intro="Everyone with an account in the guild. What you may change for each member is shown on their row." width="wide">
      <MembersTable />
    </Page>
  );
}

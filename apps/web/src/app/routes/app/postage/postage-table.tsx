import { Page } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { PostageTableEditor } from '../../../../features/postage/components/postage-table-editor.tsx';

export function Component() {
  const user = useSessionUser();
  const currency = useSession().data?.guild.currency ?? 'USD';
  return (
    <Page
      title="Postage table"
      width="wide"
      intro="The guild’s postage rates by zone and weight, and the packaging sellers post in. Buyers see a quote worked out from this table before they pay."
    >
      <PostageTableEditor currency={currency} units={user.units} />
    </Page>
  );
}

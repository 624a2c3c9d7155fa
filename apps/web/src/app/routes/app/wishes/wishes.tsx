import { Link } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Page, Panel } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { WishesList } from '../../../../features/wishes/components/wishes-list.tsx';

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  if (!guild) throw new Error('The wishes page opened before the session was read.');
  return (
    <Page title="Wishes" intro="Standing requests for the kind of scraps you are after.">
      <Panel title="How wishes work">
        <ul className="list-disc space-y-2 pl-6">
          <li>
            Filter <Link to={paths.app.shelf.getHref()}>the shelf</Link> for what you want, then choose “Save these filters as a wish”.
          </li>
          <li>
            Each time the librarian approves a new bundle that matches a wish, we send you <strong>one e-mail for that wish</strong>. You hear
            about each bundle once, and never about your own.
          </li>
          <li>Delete a wish when you have found what you were after.</li>
        </ul>
      </Panel>
      <WishesList units={user.units} currency={guild.currency} />
    </Page>
  );
}

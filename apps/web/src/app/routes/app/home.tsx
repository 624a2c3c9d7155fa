import { Link } from 'react-router-dom';
import { navFor } from '../../../config/nav.ts';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { SafetyNotes } from '../../../components/safety-notes.tsx';
import { useSession, useSessionUser } from '../../../features/auth/api/get-session.ts';
import { MemberSummary } from '../../../features/auth/components/member-summary.tsx';

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  const destinations = navFor(user.abilities).filter((entry) => entry.description && entry.page !== paths.app.home);
  return (
    <Page
      title={`Welcome, ${user.name}`}
      intro={guild ? `Your place in ${guild.name}’s scrap exchange${guild.town ? `, ${guild.town}` : ''}.` : undefined}
    >
      <MemberSummary user={user} />
      {destinations.length > 0 ? (
        <Panel title="Where to go">
          <ul className="grid gap-4 sm:grid-cols-2">
            {destinations.map((entry) => (
              <li key={entry.page.path} className="rounded-stitch border-2 border-seam bg-linen p-4">
                <Link to={entry.page.getHref()} className="text-lg font-bold">
                  {entry.label}
                </Link>
                <p className="text-thread-soft">{entry.description}</p>
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}
      <SafetyNotes />
    </Page>
  );
}

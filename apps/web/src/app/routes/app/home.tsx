import { Link } from 'react-router-dom';
import { NAV_ENTRIES, navFor, type NavEntry } from '../../../config/nav.ts';
import { paths } from '../../../config/paths.ts';
import { Page, Panel } from '../../../components/layouts/page.tsx';
import { SafetyNotes } from '../../../components/safety-notes.tsx';
import { useSession, useSessionUser } from '../../../features/auth/api/get-session.ts';
import { MemberSummary } from '../../../features/auth/components/member-summary.tsx';

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  const destinations = navFor(user.abilities).filter((entry) => entry.description && entry.page !== paths.app.home);
  const afterConfirming = user.emailVerified ? [] : unlockedByConfirming(user.newQuilter, destinations);
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
          {afterConfirming.length > 0 ? (
            <p>
              <strong>Once your e-mail address is confirmed:</strong> {afterConfirming.map((entry) => entry.label).join(', ')}.
            </p>
          ) : null}
        </Panel>
      ) : null}
      <SafetyNotes />
    </Page>
  );
}

/**
 * The pages an unconfirmed member does not have yet and will once the address is confirmed: listing (and so
 * their bundles), and for a new quilter the starter bundles (abilities `listBundles` and `claimStarter`).
 */
function unlockedByConfirming(newQuilter: boolean, shown: readonly NavEntry[]): NavEntry[] {
  const unlocks = new Set<string>(['listBundles', ...(newQuilter ? ['claimStarter'] : [])]);
  return NAV_ENTRIES.filter((entry) => {
    if (!entry.description || shown.includes(entry)) return false;
    const requires = entry.page.requires;
    const any: readonly string[] = requires === undefined ? [] : typeof requires === 'string' ? [requires] : requires;
    return any.some((ability) => unlocks.has(ability));
  });
}

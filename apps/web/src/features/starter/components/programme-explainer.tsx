import { Panel } from '../../../components/layouts/page.tsx';
import type { StarterStatus } from '../types.ts';

/** What the starter programme is and how its turns work, for anyone opening the page. */
export function ProgrammeExplainer({ rules }: { rules?: StarterStatus['rules'] }) {
  return (
    <Panel title="How the starter programme works">
      <ul className="list-disc space-y-2 pl-6">
        <li>
          <strong>Free fabric for new quilters.</strong> Members donate scraps and leftovers; the librarian checks each starter bundle before it is
          offered.
        </li>
        <li>
          <strong>One at a time, so everyone gets a turn.</strong> The guild sets how many starter bundles each new quilter may have in a period
          {rules ? ` — here ${rules.limitPerWindow === 1 ? 'one' : rules.limitPerWindow} every ${rules.windowDays} days` : ''}.
        </li>
        <li>
          <strong>A waiting list when none is free.</strong> The next starter bundle goes to whoever has waited longest. You get an e-mail and{' '}
          {rules ? `${rules.offerHours} hours` : 'a few days'} to accept it or pass it on; with no answer by then it goes to the next person and you
          leave the list (you can join again).
        </li>
        <li>
          <strong>Collected at a guild meeting.</strong> Choose the meeting when you claim; the librarian hands it over at the door. If no meeting is set
          yet, it is held for you and we e-mail you the date and place once the guild sets one.
        </li>
      </ul>
    </Panel>
  );
}

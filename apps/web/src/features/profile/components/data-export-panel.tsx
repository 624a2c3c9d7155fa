import { Panel } from '../../../components/layouts/page.tsx';
import { buttonClass } from '../../../components/ui/button.tsx';
import { DATA_EXPORT_HREF } from '../api/get-history.ts';

/** The member's copy of everything the guild holds about them, as one JSON file. */
export function DataExportPanel() {
  return (
    <Panel title="Your data">
      <p>
        Download everything Scrap Relay holds about you — your profile, listings, orders, starter claims, wishes and place on the waiting list — as
        one file (JSON). Buyers’ addresses on your sales are left out: they belong to the buyers.
      </p>
      <a href={DATA_EXPORT_HREF} download="my-scrap-relay-data.json" className={buttonClass('secondary')}>
        Download my data
      </a>
    </Panel>
  );
}

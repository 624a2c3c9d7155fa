import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { MeetingsList } from '../../../../features/meetings/components/meetings-list.tsx';

export function Component() {
  const user = useSessionUser();
  // Librarians and admins keep the calendar (the API's meeting rule); each meeting also says whether the viewer may edit it.
  const canCreate = user.abilities.runStarterProgramme || user.abilities.manageSettings;
  return (
    <Page title="Meetings" intro="Guild meetings are where bundles given for a meeting, and starter bundles, change hands at the door.">
      <MeetingsList canCreate={canCreate} />
    </Page>
  );
}

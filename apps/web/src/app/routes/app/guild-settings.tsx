import { useQueryClient } from '@tanstack/react-query';
import { Page } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { sessionQueryKey } from '../../../features/auth/api/get-session.ts';
import { useGuildSettings } from '../../../features/guild-settings/api/get-guild-settings.ts';
import { GuildSettingsForm } from '../../../features/guild-settings/components/guild-settings-form.tsx';
import { InviteCodePanel } from '../../../features/guild-settings/components/invite-code-panel.tsx';

export function Component() {
  const settings = useGuildSettings();
  const queryClient = useQueryClient();
  return (
    <Page title="Guild settings" intro="The rules of your guild’s exchange. Changes apply from the moment you save them.">
      <InviteCodePanel />
      {settings.isPending ? <Loading label="Loading the settings…" /> : null}
      {settings.isError ? (
        <Alert tone="error" title="The settings could not be loaded">
          <p>{settings.error.message}</p>
          <Button variant="secondary" onClick={() => settings.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {settings.isSuccess ? (
        <GuildSettingsForm
          settings={settings.data.settings}
          // The header shows the guild's name and town from the session.
          onSaved={() => void queryClient.invalidateQueries({ queryKey: sessionQueryKey })}
        />
      ) : null}
    </Page>
  );
}

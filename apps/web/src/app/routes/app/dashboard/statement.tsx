import { useSearchParams } from 'react-router-dom';
import { statementQuerySchema } from '@scrap-relay/shared';
import { Page } from '../../../../components/layouts/page.tsx';
import { PrintFrame } from '../../../../components/print-frame.tsx';
import { useSession } from '../../../../features/auth/api/get-session.ts';
import { StatementView } from '../../../../features/dashboard/components/statement-view.tsx';
import { guildMonthOf } from '../../../../features/dashboard/period.ts';
import { useGuildTimeZone } from '../../../../utils/guild-session.ts';

export function Component() {
  const guildName = useSession().data?.guild.name ?? 'The guild';
  const timeZone = useGuildTimeZone();
  const [search, setSearch] = useSearchParams();
  const asked = statementQuerySchema.safeParse({ month: search.get('month') ?? '' });
  const month = asked.success ? asked.data.month : guildMonthOf(new Date(), timeZone);
  return (
    <PrintFrame>
      <Page title="Month-end statement" intro="The guild’s money for one month, straight from the ledger: to check, print, or hand to the auditor.">
        <StatementView month={month} onMonthChange={(next) => setSearch({ month: next })} guildName={guildName} />
      </Page>
    </PrintFrame>
  );
}

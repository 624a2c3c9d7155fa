import { useParams } from 'react-router-dom';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { PackingSlip } from '../../../../features/orders/components/packing-slip.tsx';

/** `/orders/:id/packing-slip`: a print layout; the slip carries its own heading. */
export function Component() {
  const { id = '' } = useParams();
  const user = useSessionUser();
  const guildName = useSession().data?.guild.name ?? 'The guild';
  return <PackingSlip orderId={id} guildName={guildName} units={user.units} />;
}

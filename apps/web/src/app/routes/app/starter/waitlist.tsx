import { Link } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { paths } from '../../../../config/paths.ts';
import { WaitlistQueue } from '../../../../features/starter/components/waitlist-queue.tsx';

export function Component() {
  return (
    <Page
      title="Starter waiting list"
      intro="New quilters waiting for a starter bundle, in the order they asked. Each new starter bundle is offered to the person at the front."
      width="wide"
    >
      <Alert tone="info" title="Making up a starter bundle" announce={false}>
        <p>
          Use the ordinary <Link to={paths.app.newBundle.getHref()}>listing form</Link> and choose the offer “Starter bundle”. Once it is approved it is
          offered to the first person on this list, by e-mail.
        </p>
      </Alert>
      <WaitlistQueue />
    </Page>
  );
}

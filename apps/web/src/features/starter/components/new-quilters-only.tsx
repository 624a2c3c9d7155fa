import { ButtonLink } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';

/** Who starter bundles are for, and how a member they are not for can give one instead. */
export function NewQuiltersOnly({ canGive }: { canGive: boolean }) {
  return (
    <>
      <p>
        New quilters are members who joined the guild within its newcomer window, or whom the librarian has flagged as new. Your account is
        not counted as a new quilter’s, so you cannot claim a starter bundle. If you have just started quilting, ask the librarian.
      </p>
      {canGive ? (
        <>
          <p>
            Have fabric to spare? You can give a starter bundle: list a bundle and choose the offer “Starter bundle”. The librarian checks it and
            passes it to a new quilter.
          </p>
          <ButtonLink to={paths.app.newBundle.getHref()}>
            Give a starter bundle
          </ButtonLink>
        </>
      ) : null}
    </>
  );
}

import type { BundleView, UnitSystem } from '@scrap-relay/shared';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';
import { BundleContents, BundlePhoto } from './bundle-contents.tsx';

/** One free starter bundle: photo, title, contents, yield and the Claim button (when the API says the member may). */
export function StarterBundleCard({
  bundle,
  units,
  onClaim,
  postingAllowed = false,
}: {
  bundle: BundleView;
  units: UnitSystem;
  onClaim: (bundle: BundleView) => void;
  /** The guild posts starter bundles too; the new quilter pays only the postage, through the basket. */
  postingAllowed?: boolean;
}) {
  return (
    <li className="flex flex-col gap-3 rounded-stitch border-2 border-seam bg-linen p-4">
      <BundlePhoto bundle={bundle} />
      <h3 className="text-lg font-bold">{bundle.title}</h3>
      {bundle.description ? <p>{bundle.description}</p> : null}
      <BundleContents bundle={bundle} units={units} />
      <div className="mt-auto flex flex-wrap gap-3 pt-2">
        {bundle.abilities.claim ? (
          <Button onClick={() => onClaim(bundle)} className="w-full sm:w-auto">
            Claim<span className="sr-only"> “{bundle.title}”</span>
          </Button>
        ) : null}
        {bundle.abilities.claim && postingAllowed ? (
          <ButtonLink to={paths.app.basketAdd.getHref(bundle.id)} variant="secondary" className="w-full sm:w-auto">
            Have it posted (you pay the postage)<span className="sr-only"> “{bundle.title}”</span>
          </ButtonLink>
        ) : null}
      </div>
    </li>
  );
}

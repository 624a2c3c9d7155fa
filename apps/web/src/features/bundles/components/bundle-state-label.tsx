import type { BundleState, Offer } from '@scrap-relay/shared';
import { cn } from '../../../utils/cn.ts';
import { bundleStateLabel } from '../utils/bundle-text.ts';

// Tone by what the member should do next: act (returned), wait (review, checkout), done, or nothing.
const tones: Record<BundleState, string> = {
  draft: 'border-selvage bg-muslin text-thread',
  in_review: 'border-ochre bg-ochre-wash text-ochre',
  on_shelf: 'border-sage bg-sage-wash text-sage',
  held: 'border-ochre bg-ochre-wash text-ochre',
  rehomed: 'border-thread bg-thread text-white',
  returned: 'border-madder bg-madder-wash text-madder-deep',
  withdrawn: 'border-selvage bg-linen-deep text-thread-soft',
  expired: 'border-selvage bg-linen-deep text-thread-soft',
};

/** The bundle's state in words, with a border so it never relies on colour alone. */
export function BundleStateLabel({ state, offer, className }: { state: BundleState; offer: Offer | null; className?: string }) {
  return (
    <span className={cn('inline-flex items-center rounded-stitch border-2 px-2 py-0.5 font-semibold', tones[state], className)}>
      {bundleStateLabel(state, offer)}
    </span>
  );
}

import { ORDER_STATE_LABELS, type OrderState } from '@scrap-relay/shared';
import { cn } from '../../../utils/cn.ts';

// Colour only repeats the words; the label always says the state.
const TONES: Record<OrderState, string> = {
  awaiting_payment: 'border-ochre bg-ochre-wash',
  confirmed: 'border-thread bg-muslin',
  posted: 'border-cornflower bg-muslin',
  received: 'border-sage bg-sage-wash',
  handed_over: 'border-sage bg-sage-wash',
  cancelled: 'border-selvage bg-linen-deep',
  refunded: 'border-madder bg-madder-wash',
};

export function OrderStatusBadge({ state, className }: { state: OrderState; className?: string }) {
  return (
    <span className={cn('inline-flex items-center rounded-full border-2 px-3 py-0.5 font-semibold text-thread', TONES[state], className)}>
      {ORDER_STATE_LABELS[state]}
    </span>
  );
}

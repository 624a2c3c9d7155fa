/**
 * Stripe's `expand[]`: replaces an id field with the object it names, with
 * dotted paths for nested objects (`payment_intent.latest_charge`).
 */
import type { FakeContext } from './context.ts';
import { parameterInvalid } from './errors.ts';
import type { LineItemList, RefundList, StripeEvent, StripeObject } from './types.ts';

export type Expandable = StripeObject | LineItemList | RefundList | StripeEvent;

/** Stripe stops at four levels of expansion. */
const MAX_EXPAND_DEPTH = 4;

export function lineItemList(ctx: FakeContext, sessionId: string, limit = 10): LineItemList {
  const record = ctx.store.sessions.get(sessionId);
  const items = record?.lineItems ?? [];
  return {
    object: 'list',
    data: structuredClone(items.slice(0, limit)),
    has_more: items.length > limit,
    url: `/v1/checkout/sessions/${sessionId}/line_items`,
  };
}

function resolvers(ctx: FakeContext, object: Expandable): Record<string, () => Expandable | null> {
  const { store } = ctx;
  switch (object.object) {
    case 'checkout.session':
      return {
        payment_intent: () => (object.payment_intent ? (store.paymentIntents.get(object.payment_intent) ?? null) : null),
        line_items: () => lineItemList(ctx, object.id, 100),
      };
    case 'payment_intent':
      return { latest_charge: () => store.charges.get(object.latest_charge) ?? null };
    case 'charge':
      return { payment_intent: () => store.paymentIntents.get(object.payment_intent) ?? null };
    case 'refund':
    case 'dispute':
      return {
        charge: () => store.charges.get(object.charge) ?? null,
        payment_intent: () => store.paymentIntents.get(object.payment_intent) ?? null,
      };
    default:
      return {};
  }
}

/** Which fields of which object kinds expand, and into what kind. */
const EXPANDABLE: Readonly<Record<string, Readonly<Record<string, string>>>> = {
  'checkout.session': { payment_intent: 'payment_intent', line_items: 'list' },
  payment_intent: { latest_charge: 'charge' },
  charge: { payment_intent: 'payment_intent' },
  refund: { charge: 'charge', payment_intent: 'payment_intent' },
  dispute: { charge: 'charge', payment_intent: 'payment_intent' },
};

/**
 * Checks `expand` before the endpoint does anything, so a bad path never
 * leaves a half-done request behind (a session created, then a 400).
 */
export function checkExpand(kind: string, expand: readonly string[]): void {
  for (const path of expand) {
    const parts = path.split('.');
    if (parts.length > MAX_EXPAND_DEPTH) {
      throw parameterInvalid('expand', `You cannot expand more than ${MAX_EXPAND_DEPTH} levels of a property (${path}).`);
    }
    let current = kind;
    for (const part of parts) {
      const next = EXPANDABLE[current]?.[part];
      if (next === undefined) throw parameterInvalid('expand', `This property cannot be expanded (${part}).`);
      current = next;
    }
  }
}

/** A copy of `object` with the requested fields expanded; the stored object is never handed out. */
export function present(ctx: FakeContext, object: Expandable, expand: readonly string[]): Record<string, unknown> {
  checkExpand(object.object, expand);
  const out = structuredClone(object) as unknown as Record<string, unknown>;
  const byField = new Map<string, string[]>();
  for (const path of expand) {
    const [head, ...rest] = path.split('.') as [string, ...string[]];
    const nested = byField.get(head) ?? [];
    if (rest.length > 0) nested.push(rest.join('.'));
    byField.set(head, nested);
  }
  const available = resolvers(ctx, object);
  for (const [field, nested] of byField) {
    const value = available[field]?.() ?? null;
    out[field] = value === null ? null : present(ctx, value, nested);
  }
  return out;
}

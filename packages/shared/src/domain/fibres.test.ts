import { describe, expect, it } from 'vitest';
import {
  allowsFulfilment,
  BAG_OUT_ORDER_STATES,
  BUNDLE_STATES,
  BUNDLE_TRANSITIONS,
  CUT_KINDS,
  CUT_KIND_LABELS,
  FIBRES,
  FIBRE_LABELS,
  FIBRE_TYPICAL_GSM,
  CREDIT_WAITING_ORDER_STATES,
  HANDOVER_UNTICK,
  ORDER_STATES,
  ORDER_TRANSITIONS,
  canOrderTransition,
  type OrderState,
  canTransition,
} from './fibres.ts';

describe('fibres', () => {
  it('lists the fibres of PRODUCT.md, each with a label and a typical weight', () => {
    expect(FIBRES).toEqual(['quilting_cotton', 'batik', 'flannel', 'linen', 'lawn_voile', 'wool', 'knit', 'mixed_unknown']);
    for (const fibre of FIBRES) {
      expect(FIBRE_LABELS[fibre]).toMatch(/\S/);
      expect(FIBRE_TYPICAL_GSM[fibre]).toBeGreaterThan(0);
    }
  });

  it('uses the CHECKS.md defaults: cotton 140, batik 140 (common practice), flannel 185 (from memory)', () => {
    expect(FIBRE_TYPICAL_GSM.quilting_cotton).toBe(140);
    expect(FIBRE_TYPICAL_GSM.batik).toBe(140);
    expect(FIBRE_TYPICAL_GSM.flannel).toBe(185);
  });

  it('labels every cut kind', () => {
    expect(CUT_KINDS).toHaveLength(11);
    for (const kind of CUT_KINDS) expect(CUT_KIND_LABELS[kind]).toMatch(/\S/);
  });
});

describe('bundle states (design choice)', () => {
  it('follows the main line draft → in_review → on_shelf → held → rehomed', () => {
    expect(canTransition('draft', 'in_review')).toBe(true);
    expect(canTransition('in_review', 'on_shelf')).toBe(true);
    expect(canTransition('on_shelf', 'held')).toBe(true);
    expect(canTransition('held', 'rehomed')).toBe(true);
  });

  it('lets a returned bundle be resubmitted, and releases a held one', () => {
    expect(canTransition('in_review', 'returned')).toBe(true);
    expect(canTransition('returned', 'in_review')).toBe(true);
    expect(canTransition('held', 'on_shelf')).toBe(true);
    expect(canTransition('on_shelf', 'expired')).toBe(true);
  });

  it('refuses skipping review, selling from a draft, and staying put', () => {
    expect(canTransition('draft', 'on_shelf')).toBe(false);
    expect(canTransition('returned', 'on_shelf')).toBe(false);
    expect(canTransition('draft', 'held')).toBe(false);
    expect(canTransition('expired', 'held')).toBe(false);
    for (const state of BUNDLE_STATES) expect(canTransition(state, state)).toBe(false);
  });

  it('only names known states', () => {
    for (const targets of Object.values(BUNDLE_TRANSITIONS)) {
      for (const target of targets) expect(BUNDLE_STATES).toContain(target);
    }
  });
});

describe('order states (design choice)', () => {
  it('moves paid orders to posted or handed over, and ends in received, cancelled or refunded', () => {
    expect(canOrderTransition('awaiting_payment', 'confirmed')).toBe(true);
    expect(canOrderTransition('confirmed', 'posted')).toBe(true);
    expect(canOrderTransition('posted', 'received')).toBe(true);
    expect(canOrderTransition('confirmed', 'handed_over')).toBe(true);
    expect(canOrderTransition('received', 'refunded')).toBe(true);
    expect(canOrderTransition('awaiting_payment', 'posted')).toBe(false);
    expect(canOrderTransition('posted', 'cancelled')).toBe(false);
    for (const to of ORDER_STATES) {
      expect(canOrderTransition('cancelled', to)).toBe(false);
      expect(canOrderTransition('refunded', to)).toBe(false);
    }
  });

  it('goes back only to put right a handover ticked by mistake: posted and received bags never return to confirmed', () => {
    expect(canOrderTransition(HANDOVER_UNTICK.from, HANDOVER_UNTICK.to)).toBe(true);
    const backToConfirmed = ORDER_STATES.filter((from) => from !== 'awaiting_payment' && canOrderTransition(from, 'confirmed'));
    expect(backToConfirmed).toEqual(['handed_over']);
  });
});

describe('when a seller credit may be paid out (design choice)', () => {
  it('waits exactly in the states from which the bag can still be posted or handed over', () => {
    const bagCanStillGoOut = ORDER_STATES.filter((from) => canOrderTransition(from, 'posted') || canOrderTransition(from, 'handed_over'));
    expect([...CREDIT_WAITING_ORDER_STATES]).toEqual(bagCanStillGoOut);
  });

  it('is payable in posted, handed over and every state they lead to, except a refund (which reverses the credit)', () => {
    const reached = new Set<OrderState>(['posted', 'handed_over']);
    for (let grew = true; grew; ) {
      grew = false;
      for (const from of [...reached]) {
        for (const to of ORDER_TRANSITIONS[from]) {
          // The same-day untick says the bag never went out: it leads back to waiting, not onward from a bag out.
          if (from === HANDOVER_UNTICK.from && to === HANDOVER_UNTICK.to) continue;
          if (reached.has(to)) continue;
          reached.add(to);
          grew = true;
        }
      }
    }
    reached.delete('refunded');
    expect(new Set(BAG_OUT_ORDER_STATES)).toEqual(reached);
    for (const state of BAG_OUT_ORDER_STATES) expect(CREDIT_WAITING_ORDER_STATES).not.toContain(state);
  });
});

describe('how offers change hands (design choice)', () => {
  it('posts sales, postage-only gifts and starter bundles; meets for meeting gifts and willing sales', () => {
    expect(allowsFulfilment({ offer: 'sale', meetingHandoverOk: false }, 'post')).toBe(true);
    expect(allowsFulfilment({ offer: 'sale', meetingHandoverOk: false }, 'meeting')).toBe(false);
    expect(allowsFulfilment({ offer: 'sale', meetingHandoverOk: true }, 'meeting')).toBe(true);
    expect(allowsFulfilment({ offer: 'postage_only', meetingHandoverOk: false }, 'meeting')).toBe(false);
    expect(allowsFulfilment({ offer: 'meeting', meetingHandoverOk: false }, 'post')).toBe(false);
    expect(allowsFulfilment({ offer: 'starter', meetingHandoverOk: false }, 'post')).toBe(true);
    expect(allowsFulfilment({ offer: 'starter', meetingHandoverOk: false }, 'meeting')).toBe(false);
  });
});

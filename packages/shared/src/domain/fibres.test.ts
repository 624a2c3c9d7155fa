import { describe, expect, it } from 'vitest';
import {
  allowsFulfilment,
  BUNDLE_STATES,
  BUNDLE_TRANSITIONS,
  CUT_KINDS,
  CUT_KIND_LABELS,
  FIBRES,
  FIBRE_LABELS,
  FIBRE_TYPICAL_GSM,
  ORDER_STATES,
  canOrderTransition,
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

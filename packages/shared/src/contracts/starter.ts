import type { BundleView } from './bundles.ts';

export type StarterEligibilityView =
  | { eligible: true }
  | { eligible: false; reason: 'not_new_quilter' | 'over_limit'; nextEligibleAt: string | null };

export interface StarterOfferSummary {
  id: string;
  bundleId: string;
  title: string;
  expiresAt: string;
}

export interface StarterClaimSummary {
  id: string;
  state: 'claimed' | 'handed_over' | 'cancelled';
  claimedAt: string;
  bundle: { id: string; title: string };
  meeting: { id: string; startsAt: string; place: string } | null;
}

export interface StarterStatus {
  /** The guild's own limits, as its settings say. */
  rules: { limitPerWindow: number; windowDays: number; offerHours: number; postingAllowed: boolean };
  eligibility: StarterEligibilityView;
  /** The member's open place in the queue (1 = next in line), if any. */
  waitlist: { status: 'waiting' | 'offered'; position: number; joinedAt: string } | null;
  offer: StarterOfferSummary | null;
  claims: StarterClaimSummary[];
}

export interface StarterBundlesResponse {
  status: StarterStatus;
  /** Free starter bundles; empty unless the member may claim now. */
  items: BundleView[];
}

export interface StarterClaimResult {
  claim: { id: string; bundleId: string; meetingId: string | null; state: string; claimedAt: string };
}

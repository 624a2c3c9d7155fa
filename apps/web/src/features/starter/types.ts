export type {
  StarterBundlesResponse,
  StarterClaimResult,
  StarterClaimSummary,
  StarterEligibilityView,
  StarterOfferSummary,
  StarterStatus,
} from '@scrap-relay/shared';

export interface DashboardFigures {
  period: { from: string | null; to: string | null; label: string };
  weightRehomedGrams: number;
  bundlesRehomedByOffer: { offer: string; units: number }[];
  newQuiltersServed: number;
  waitingForReview: number;
  medianReviewHours: number | null;
  bundlesExpired: number;
  /** Money figures are present only for officers who see the guild's money. */
  money: {
    /** Guild fees after refunds, less the card processor's fees the guild bore (processing and disputes): what the guild kept. */
    fundsRaisedMinor: number;
    guildFeesMinor: number;
    processingCostMinor: number;
    /** The card processor's fees for handling disputes, less any it gave back. */
    disputeFeesMinor: number;
    /** Card payments the buyers' banks took back in disputes the guild lost. */
    disputesLostMinor: number;
    sellerCreditsMinor: number;
    payoutsMinor: number;
    postagePaidMinor: number;
    refundsMinor: number;
    currency: string;
  } | null;
  charts: {
    weightByMonth: { month: string; offer: string; grams: number }[];
    shelfByValue: { value: string; bundles: number }[];
    shelfByCut: { cut: string; bundles: number }[];
    reviewHoursByMonth: { month: string; medianHours: number }[];
  };
}

export interface MonthStatement {
  month: string;
  currency: string;
  chargesMinor: number;
  guildFeesMinor: number;
  refundsMinor: number;
  processingCostMinor: number;
  /** Payments the buyers' banks took back through the card processor: disputes the guild lost. */
  disputesLostMinor: number;
  /** The card processor's fees for handling disputes, less any it gave back with a won dispute. */
  disputeFeesMinor: number;
  payoutsMinor: number;
  sellerCreditsMinor: number;
  closingBalances: { sellerId: string; name: string; balanceMinor: number }[];
  closingBalancesTotalMinor: number;
}

export interface MemberHistory {
  bundlesRehomed: number;
  gramsPassedOn: number;
  bundlesReceived: number;
  gramsReceived: number;
}

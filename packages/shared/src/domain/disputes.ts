/**
 * Card-payment disputes, in the card service's terms (Stripe's Dispute object: `status`, `reason`) and in the
 * treasurer's words. The card service may add statuses and reasons; an unknown one reads as itself and counts as open.
 */

/** Where a dispute stands for the guild's money: still open, decided for the guild, against it, or closed without a decision. */
export type DisputeStage = 'open' | 'won' | 'lost' | 'closed';

const STAGES: Readonly<Record<string, DisputeStage>> = {
  won: 'won',
  lost: 'lost',
  // An inquiry the bank closed without turning it into a dispute, or one settled before it became one.
  warning_closed: 'closed',
  prevented: 'closed',
};

export const disputeStage = (status: string): DisputeStage => STAGES[status] ?? 'open';

/**
 * How far along a status is (design choice, from the order the card service's statuses follow: an inquiry, a
 * dispute, answered, decided; an appeal after the first answer). News about a dispute can arrive out of order, so a
 * status further back than the one recorded is news that was overtaken, not a step back. An unknown status ranks
 * with the open ones it most likely sits between, after the known open ones.
 */
const RANKS: Readonly<Record<string, number>> = {
  warning_needs_response: 1,
  warning_under_review: 2,
  // A closed inquiry may still become a dispute under the same id.
  warning_closed: 3,
  needs_response: 4,
  under_review: 5,
  appeal_needs_response: 6,
  appeal_under_review: 7,
  prevented: 8,
  won: 8,
  lost: 8,
};

/** The rank of a known status; null for one the card service added later, which is never taken for overtaken news. */
export const disputeStatusRank = (status: string): number | null => RANKS[status] ?? null;

/** Whether news of `status` was overtaken by the recorded one: both known, and the new one further back. */
export function isOvertakenDisputeStatus(status: string, recorded: string): boolean {
  const [rank, recordedRank] = [disputeStatusRank(status), disputeStatusRank(recorded)];
  return rank !== null && recordedRank !== null && rank < recordedRank;
}

/** A decision that stands: won, lost, or settled before it became a dispute. A closed inquiry can still become one. */
export const isFinalDisputeStatus = (status: string): boolean => status === 'won' || status === 'lost' || status === 'prevented';

export const DISPUTE_STATUS_LABELS: Readonly<Record<string, string>> = {
  warning_needs_response: 'Inquiry: the bank asks the guild for information',
  warning_under_review: 'Inquiry answered: the bank is looking at it',
  warning_closed: 'Inquiry closed without a dispute',
  needs_response: 'Waiting for the guild’s answer',
  under_review: 'Answered: the bank is deciding',
  appeal_needs_response: 'Appeal: waiting for the guild’s answer',
  appeal_under_review: 'Appeal answered: the bank is deciding',
  won: 'Decided for the guild: the money stays',
  lost: 'Decided for the buyer: the money went back',
  prevented: 'Settled before it became a dispute',
};

/** What the cardholder's bank gave as the reason, in plain words (the values are the card service's). */
export const DISPUTE_REASON_LABELS: Readonly<Record<string, string>> = {
  bank_cannot_process: 'The bank could not process the payment',
  check_returned: 'A returned cheque',
  credit_not_processed: 'The buyer says a refund they were promised never came',
  customer_initiated: 'The buyer asked their bank to reverse the payment',
  debit_not_authorized: 'The buyer says they did not allow the payment',
  duplicate: 'The buyer says they were charged twice',
  fraudulent: 'The cardholder says they did not make this payment',
  general: 'No particular reason given',
  incorrect_account_details: 'The account details were wrong',
  insufficient_funds: 'Not enough money in the account',
  noncompliant: 'The card network says the payment broke its rules',
  product_not_received: 'The buyer says the order never arrived',
  product_unacceptable: 'The buyer says the bundles were not as described',
  subscription_canceled: 'The buyer says a subscription was cancelled',
  unrecognized: 'The cardholder does not recognise the payment',
};

export const disputeStatusLabel = (status: string): string => DISPUTE_STATUS_LABELS[status] ?? status;
export const disputeReasonLabel = (reason: string): string => DISPUTE_REASON_LABELS[reason] ?? reason;

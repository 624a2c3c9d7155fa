import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

const OLD_KINDS = `'charge', 'guild_fee', 'seller_credit', 'processing_cost', 'refund', 'payout'`;

/** The office figures of a ledger entry; `processing` leaves lost disputes out when `withDisputes`, which get their own figure. */
const ledgerDeltas = (withDisputes: boolean) => `
  CREATE OR REPLACE FUNCTION office_ledger_deltas(p_kind text, p_reverses text, p_account text, p_amount integer)
  RETURNS TABLE (key text, amount bigint) LANGUAGE sql IMMUTABLE AS $$
    SELECT k, a FROM (VALUES
      ('charges', CASE WHEN p_kind = 'charge' THEN -p_amount::bigint END),
      ('fees', CASE WHEN p_account = 'guild' AND (p_kind = 'guild_fee' OR p_reverses = 'guild_fee') THEN p_amount::bigint END),
      ('refunds', CASE WHEN p_account = 'buyer' AND p_kind = 'refund' THEN p_amount::bigint END),
      ('processing', CASE WHEN p_account = 'processor'${withDisputes ? ` AND p_kind <> 'dispute'` : ''} THEN p_amount::bigint END),${
        withDisputes ? `\n      ('disputes', CASE WHEN p_account = 'processor' AND p_kind = 'dispute' THEN p_amount::bigint END),` : ''
      }
      ('payouts', CASE WHEN p_account = 'payouts' THEN p_amount::bigint END),
      ('credits', CASE WHEN p_account LIKE 'seller:%' AND p_kind <> 'payout' THEN p_amount::bigint END)
    ) v(k, a) WHERE a IS NOT NULL AND a <> 0
  $$;`;

/**
 * Card-payment disputes: the cardholder's bank questions an order's payment (at most one per payment, so one per
 * order). The row follows the card service's dispute: its status as the service names it (not checked here, since
 * the service adds statuses over time), what the bank may take back, the reason it gave and its deadline for the
 * guild's evidence. A lost dispute is booked in the ledger as entries of kind `dispute`, which the office figures
 * count apart from the card processor's fees. Orders are found by their payment when a dispute arrives.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE order_disputes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      order_id uuid NOT NULL UNIQUE REFERENCES orders(id),
      stripe_dispute_id text NOT NULL UNIQUE,
      status text NOT NULL,
      reason text NOT NULL,
      amount_minor integer NOT NULL CHECK (amount_minor > 0),
      currency char(3) NOT NULL,
      evidence_due_by timestamptz,
      opened_at timestamptz NOT NULL,
      closed_at timestamptz,
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX order_disputes_open ON order_disputes (opened_at) WHERE closed_at IS NULL;
    CREATE INDEX orders_payment_intent ON orders (stripe_payment_intent_id) WHERE stripe_payment_intent_id IS NOT NULL;

    ALTER TABLE ledger_entries DROP CONSTRAINT ledger_entries_kind_check;
    ALTER TABLE ledger_entries ADD CONSTRAINT ledger_entries_kind_check CHECK (kind IN (${OLD_KINDS}, 'dispute'));
    ${ledgerDeltas(true)}
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DO $$ BEGIN
      IF EXISTS (SELECT 1 FROM ledger_entries WHERE kind = 'dispute') THEN
        RAISE EXCEPTION 'The ledger holds lost disputes (entries of kind dispute); the migration cannot be undone without losing them.';
      END IF;
    END $$;
    ${ledgerDeltas(false)}
    ALTER TABLE ledger_entries DROP CONSTRAINT ledger_entries_kind_check;
    ALTER TABLE ledger_entries ADD CONSTRAINT ledger_entries_kind_check CHECK (kind IN (${OLD_KINDS}));
    DROP INDEX IF EXISTS orders_payment_intent;
    DROP TABLE IF EXISTS order_disputes;
  `);
};

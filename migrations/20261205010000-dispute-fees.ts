import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

const KINDS = `'charge', 'guild_fee', 'seller_credit', 'processing_cost', 'refund', 'payout', 'dispute'`;

/** The office figures of a ledger entry; with `withDisputeFees`, the processor's dispute fees get their own figure. */
const ledgerDeltas = (withDisputeFees: boolean) => `
  CREATE OR REPLACE FUNCTION office_ledger_deltas(p_kind text, p_reverses text, p_account text, p_amount integer)
  RETURNS TABLE (key text, amount bigint) LANGUAGE sql IMMUTABLE AS $$
    SELECT k, a FROM (VALUES
      ('charges', CASE WHEN p_kind = 'charge' THEN -p_amount::bigint END),
      ('fees', CASE WHEN p_account = 'guild' AND (p_kind = 'guild_fee' OR p_reverses = 'guild_fee') THEN p_amount::bigint END),
      ('refunds', CASE WHEN p_account = 'buyer' AND p_kind = 'refund' THEN p_amount::bigint END),
      ('processing', CASE WHEN p_account = 'processor' AND p_kind NOT IN (${withDisputeFees ? `'dispute', 'dispute_fee'` : `'dispute'`}) THEN p_amount::bigint END),
      ('disputes', CASE WHEN p_account = 'processor' AND p_kind = 'dispute' THEN p_amount::bigint END),${
        withDisputeFees ? `\n      ('dispute_fees', CASE WHEN p_account = 'processor' AND p_kind = 'dispute_fee' THEN p_amount::bigint END),` : ''
      }
      ('payouts', CASE WHEN p_account = 'payouts' THEN p_amount::bigint END),
      ('credits', CASE WHEN p_account LIKE 'seller:%' AND p_kind <> 'payout' THEN p_amount::bigint END)
    ) v(k, a) WHERE a IS NOT NULL AND a <> 0
  $$;`;

/**
 * The card processor's fee for handling a dispute: booked as entries of kind `dispute_fee` (processor +fee, guild
 * −fee) at the figure the processor reports on the dispute's balance movements, and counted in the office figures
 * on their own line rather than in the processing cost. No entry of the new kind exists yet, so the tallies need
 * no rebuild. The dispute's row keeps the fee standing, for the order page.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE ledger_entries DROP CONSTRAINT ledger_entries_kind_check;
    ALTER TABLE ledger_entries ADD CONSTRAINT ledger_entries_kind_check CHECK (kind IN (${KINDS}, 'dispute_fee'));
    ALTER TABLE order_disputes ADD COLUMN fee_minor integer NOT NULL DEFAULT 0;
    ${ledgerDeltas(true)}
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DO $$ BEGIN
      IF EXISTS (SELECT 1 FROM ledger_entries WHERE kind = 'dispute_fee') THEN
        RAISE EXCEPTION 'The ledger holds dispute fees (entries of kind dispute_fee); the migration cannot be undone without losing them.';
      END IF;
    END $$;
    ${ledgerDeltas(false)}
    ALTER TABLE order_disputes DROP COLUMN fee_minor;
    ALTER TABLE ledger_entries DROP CONSTRAINT ledger_entries_kind_check;
    ALTER TABLE ledger_entries ADD CONSTRAINT ledger_entries_kind_check CHECK (kind IN (${KINDS}));
  `);
};

import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE meetings ADD COLUMN reminder_sent_at timestamptz;

    CREATE TABLE starter_claims (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      bundle_id uuid NOT NULL REFERENCES bundles(id),
      member_id uuid NOT NULL REFERENCES members(id),
      meeting_id uuid REFERENCES meetings(id),
      state text NOT NULL DEFAULT 'claimed' CHECK (state IN ('claimed', 'handed_over', 'cancelled')),
      claimed_at timestamptz NOT NULL DEFAULT now(),
      handed_over_at timestamptz,
      handed_over_by uuid REFERENCES members(id),
      cancelled_at timestamptz,
      cancel_reason text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX starter_claims_member ON starter_claims (member_id, claimed_at);
    CREATE INDEX starter_claims_meeting ON starter_claims (meeting_id);

    CREATE TABLE waitlist_entries (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      member_id uuid NOT NULL REFERENCES members(id),
      status text NOT NULL DEFAULT 'waiting' CHECK (status IN ('waiting', 'offered', 'declined', 'lapsed', 'claimed', 'left', 'removed')),
      joined_at timestamptz NOT NULL DEFAULT now(),
      removed_reason text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    -- A member is in the queue at most once at a time.
    CREATE UNIQUE INDEX waitlist_entries_one_open ON waitlist_entries (member_id) WHERE status IN ('waiting', 'offered');
    CREATE INDEX waitlist_entries_queue ON waitlist_entries (joined_at, id) WHERE status = 'waiting';

    CREATE TABLE waitlist_offers (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      entry_id uuid NOT NULL REFERENCES waitlist_entries(id),
      bundle_id uuid NOT NULL REFERENCES bundles(id),
      status text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'accepted', 'declined', 'lapsed', 'withdrawn')),
      offered_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      answered_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX waitlist_offers_one_open_per_bundle ON waitlist_offers (bundle_id) WHERE status = 'open';
    CREATE INDEX waitlist_offers_expiry ON waitlist_offers (expires_at) WHERE status = 'open';

    ALTER TABLE orders ADD COLUMN handed_over_by uuid REFERENCES members(id);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE orders DROP COLUMN IF EXISTS handed_over_by;
    DROP TABLE IF EXISTS waitlist_offers;
    DROP TABLE IF EXISTS waitlist_entries;
    DROP TABLE IF EXISTS starter_claims;
    ALTER TABLE meetings DROP COLUMN IF EXISTS reminder_sent_at;
  `);
};

import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE guild ADD COLUMN postage_table jsonb;
    ALTER TABLE members ADD COLUMN postal_address jsonb;

    CREATE TABLE meetings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      starts_at timestamptz NOT NULL,
      place text NOT NULL,
      notes text NOT NULL DEFAULT '',
      created_by uuid REFERENCES members(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX meetings_starts_at ON meetings (starts_at);

    CREATE TABLE orders (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      reference text NOT NULL UNIQUE,
      buyer_id uuid NOT NULL REFERENCES members(id),
      seller_id uuid NOT NULL REFERENCES members(id),
      state text NOT NULL CHECK (state IN ('awaiting_payment', 'confirmed', 'posted', 'received', 'handed_over', 'cancelled', 'refunded')),
      fulfilment text NOT NULL CHECK (fulfilment IN ('post', 'meeting')),
      meeting_id uuid REFERENCES meetings(id),
      address jsonb,
      currency char(3) NOT NULL,
      subtotal_minor integer NOT NULL CHECK (subtotal_minor >= 0),
      postage_minor integer NOT NULL CHECK (postage_minor >= 0),
      charge_minor integer NOT NULL CHECK (charge_minor >= 0),
      guild_fee_minor integer NOT NULL CHECK (guild_fee_minor >= 0),
      processing_cost_minor integer NOT NULL CHECK (processing_cost_minor >= 0),
      seller_credit_minor integer NOT NULL CHECK (seller_credit_minor >= 0),
      postage_quote jsonb,
      stripe_session_id text UNIQUE,
      checkout_url text,
      stripe_payment_intent_id text,
      hold_expires_at timestamptz,
      paid_at timestamptz,
      posted_at timestamptz,
      tracking_number text,
      received_at timestamptz,
      handed_over_at timestamptz,
      cancelled_at timestamptz,
      cancel_reason text,
      refunded_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT orders_post_has_address CHECK (fulfilment <> 'post' OR address IS NOT NULL),
      CONSTRAINT orders_meeting_has_meeting CHECK (fulfilment <> 'meeting' OR meeting_id IS NOT NULL)
    );
    CREATE INDEX orders_buyer ON orders (buyer_id, created_at DESC);
    CREATE INDEX orders_seller ON orders (seller_id, created_at DESC);
    CREATE INDEX orders_holds ON orders (hold_expires_at) WHERE state = 'awaiting_payment';
    CREATE INDEX orders_posted ON orders (posted_at) WHERE state = 'posted';
    CREATE INDEX orders_meeting ON orders (meeting_id) WHERE meeting_id IS NOT NULL;

    CREATE TABLE order_items (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      order_id uuid NOT NULL REFERENCES orders(id) ON DELETE CASCADE,
      bundle_id uuid NOT NULL REFERENCES bundles(id),
      quantity integer NOT NULL CHECK (quantity > 0),
      unit_price_minor integer NOT NULL CHECK (unit_price_minor >= 0),
      title text NOT NULL,
      weight_grams integer NOT NULL
    );
    CREATE INDEX order_items_order ON order_items (order_id);
    CREATE INDEX order_items_bundle ON order_items (bundle_id);

    CREATE TABLE payouts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      seller_id uuid NOT NULL REFERENCES members(id),
      amount_minor integer NOT NULL CHECK (amount_minor > 0),
      currency char(3) NOT NULL,
      method text NOT NULL,
      reference text NOT NULL DEFAULT '',
      recorded_by uuid NOT NULL REFERENCES members(id),
      created_at timestamptz NOT NULL DEFAULT now()
    );

    -- Double entry: the rows of one transaction_id always sum to zero.
    CREATE TABLE ledger_entries (
      id bigserial PRIMARY KEY,
      transaction_id uuid NOT NULL,
      order_id uuid REFERENCES orders(id),
      payout_id uuid REFERENCES payouts(id),
      kind text NOT NULL CHECK (kind IN ('charge', 'guild_fee', 'seller_credit', 'processing_cost', 'refund', 'payout')),
      reverses text,
      account text NOT NULL,
      amount_minor integer NOT NULL,
      currency char(3) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX ledger_entries_created ON ledger_entries (created_at);
    CREATE INDEX ledger_entries_account ON ledger_entries (account);
    CREATE INDEX ledger_entries_order ON ledger_entries (order_id);

    CREATE TABLE stripe_events (
      id text PRIMARY KEY,
      type text NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE order_problems (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      order_id uuid NOT NULL REFERENCES orders(id) ON DELETE CASCADE,
      reporter_id uuid NOT NULL REFERENCES members(id),
      message text NOT NULL,
      resolved_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX order_problems_open ON order_problems (created_at) WHERE resolved_at IS NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TABLE IF EXISTS order_problems;
    DROP TABLE IF EXISTS stripe_events;
    DROP TABLE IF EXISTS ledger_entries;
    DROP TABLE IF EXISTS payouts;
    DROP TABLE IF EXISTS order_items;
    DROP TABLE IF EXISTS orders;
    DROP TABLE IF EXISTS meetings;
    ALTER TABLE members DROP COLUMN IF EXISTS postal_address;
    ALTER TABLE guild DROP COLUMN IF EXISTS postage_table;
  `);
};

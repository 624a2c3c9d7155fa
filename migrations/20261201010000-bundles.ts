import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE bundles (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      seller_id uuid NOT NULL REFERENCES members(id),
      state text NOT NULL DEFAULT 'draft'
        CHECK (state IN ('draft', 'in_review', 'on_shelf', 'held', 'rehomed', 'returned', 'withdrawn', 'expired')),
      title text NOT NULL DEFAULT '',
      description text NOT NULL DEFAULT '',
      offer text CHECK (offer IN ('sale', 'postage_only', 'meeting', 'starter')),
      price_minor integer CHECK (price_minor IS NULL OR price_minor > 0),
      currency char(3) NOT NULL,
      meeting_handover_ok boolean NOT NULL DEFAULT false,
      quantity integer NOT NULL DEFAULT 1 CHECK (quantity BETWEEN 1 AND 50),
      quantity_available integer NOT NULL DEFAULT 1 CHECK (quantity_available >= 0 AND quantity_available <= quantity),
      weight_grams integer CHECK (weight_grams IS NULL OR weight_grams > 0),
      fibre text,
      cut_kinds text[] NOT NULL DEFAULT '{}',
      colour_value text,
      colour_family text,
      prewashed boolean NOT NULL DEFAULT false,
      smoke_free boolean NOT NULL DEFAULT false,
      pet_free boolean NOT NULL DEFAULT false,
      pieces jsonb NOT NULL DEFAULT '[]',
      review_notes text,
      submitted_at timestamptz,
      reviewed_at timestamptz,
      on_shelf_at timestamptz,
      expires_at timestamptz,
      search tsvector GENERATED ALWAYS AS (
        setweight(to_tsvector('english', coalesce(title, '')), 'A') || setweight(to_tsvector('english', coalesce(description, '')), 'B')
      ) STORED,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT bundles_sale_has_price CHECK (offer IS DISTINCT FROM 'sale' OR state = 'draft' OR price_minor IS NOT NULL),
      CONSTRAINT bundles_free_has_no_price CHECK (offer IS NULL OR offer = 'sale' OR price_minor IS NULL)
    );
    CREATE INDEX bundles_seller ON bundles (seller_id, updated_at DESC);
    CREATE INDEX bundles_review_queue ON bundles (submitted_at) WHERE state = 'in_review';
    CREATE INDEX bundles_shelf_newest ON bundles (on_shelf_at, id) WHERE state = 'on_shelf';
    CREATE INDEX bundles_shelf_price ON bundles (price_minor NULLS FIRST, id) WHERE state = 'on_shelf';
    CREATE INDEX bundles_shelf_weight ON bundles (weight_grams, id) WHERE state = 'on_shelf';
    CREATE INDEX bundles_shelf_cut_kinds ON bundles USING gin (cut_kinds) WHERE state = 'on_shelf';
    CREATE INDEX bundles_search ON bundles USING gin (search) WHERE state = 'on_shelf';
    CREATE INDEX bundles_expiry ON bundles (expires_at) WHERE state = 'on_shelf';

    CREATE TABLE bundle_photos (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      bundle_id uuid NOT NULL REFERENCES bundles(id) ON DELETE CASCADE,
      position integer NOT NULL,
      display_key text NOT NULL,
      thumb_key text NOT NULL,
      content_type text NOT NULL,
      width integer NOT NULL,
      height integer NOT NULL,
      average_hex char(7) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX bundle_photos_bundle ON bundle_photos (bundle_id, position);

    CREATE TABLE bundle_reviews (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      bundle_id uuid NOT NULL REFERENCES bundles(id) ON DELETE CASCADE,
      reviewer_id uuid NOT NULL REFERENCES members(id),
      decision text NOT NULL CHECK (decision IN ('approve', 'return')),
      notes text,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX bundle_reviews_bundle ON bundle_reviews (bundle_id, created_at);

    CREATE TABLE wishes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      member_id uuid NOT NULL REFERENCES members(id) ON DELETE CASCADE,
      name text NOT NULL,
      filters jsonb NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX wishes_member ON wishes (member_id);

    -- one e-mail per wish per bundle, however often a bundle is approved
    CREATE TABLE wish_notifications (
      wish_id uuid NOT NULL REFERENCES wishes(id) ON DELETE CASCADE,
      bundle_id uuid NOT NULL REFERENCES bundles(id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (wish_id, bundle_id)
    );
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TABLE IF EXISTS wish_notifications;
    DROP TABLE IF EXISTS wishes;
    DROP TABLE IF EXISTS bundle_reviews;
    DROP TABLE IF EXISTS bundle_photos;
    DROP TABLE IF EXISTS bundles;
  `);
};

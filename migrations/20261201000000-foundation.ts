import type { MigrationFn } from 'umzug';
import type { Sequelize } from 'sequelize';

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE guild (
      id smallint PRIMARY KEY DEFAULT 1 CHECK (id = 1),
      name text NOT NULL,
      town text NOT NULL DEFAULT '',
      currency char(3) NOT NULL DEFAULT 'USD',
      default_units text NOT NULL DEFAULT 'imperial' CHECK (default_units IN ('imperial', 'metric')),
      settings jsonb NOT NULL DEFAULT '{}',
      invite_code text NOT NULL,
      invite_code_rotated_at timestamptz NOT NULL DEFAULT now(),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE members (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL,
      email text NOT NULL,
      password_hash text NOT NULL,
      roles text[] NOT NULL DEFAULT ARRAY['member'],
      new_quilter_flag boolean NOT NULL DEFAULT false,
      joined_at timestamptz NOT NULL DEFAULT now(),
      email_verified_at timestamptz,
      active boolean NOT NULL DEFAULT true,
      units text CHECK (units IN ('imperial', 'metric')),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT members_roles_known CHECK (roles <@ ARRAY['member', 'librarian', 'treasurer', 'admin'])
    );
    CREATE UNIQUE INDEX members_email_unique ON members (lower(email));

    CREATE TABLE member_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      member_id uuid NOT NULL REFERENCES members(id) ON DELETE CASCADE,
      purpose text NOT NULL CHECK (purpose IN ('email_verification', 'password_reset')),
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX member_tokens_member ON member_tokens (member_id, purpose);

    -- express-session store (connect-pg-simple's table)
    CREATE TABLE session (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    );
    CREATE INDEX session_expire ON session (expire);

    -- express-rate-limit store: shared by every API process
    CREATE TABLE rate_limit_hits (
      key text PRIMARY KEY,
      hits integer NOT NULL,
      reset_at timestamptz NOT NULL
    );
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TABLE IF EXISTS rate_limit_hits;
    DROP TABLE IF EXISTS session;
    DROP TABLE IF EXISTS member_tokens;
    DROP TABLE IF EXISTS members;
    DROP TABLE IF EXISTS guild;
  `);
};

// Organizations, users, sessions (connect-pg-simple) and the socket.io adapter's table.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE organizations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      kind text NOT NULL CHECK (kind IN ('farm', 'apiary')),
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 160),
      time_zone text NOT NULL DEFAULT 'America/Los_Angeles',
      spray_buffer_m double precision NOT NULL DEFAULT 1609.344 CHECK (spray_buffer_m >= 0),
      billing_email text,
      tax_rate_bp integer NOT NULL DEFAULT 0 CHECK (tax_rate_bp BETWEEN 0 AND 10000),
      currency char(3) NOT NULL DEFAULT 'USD',
      colonies_owned integer CHECK (colonies_owned >= 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid REFERENCES organizations(id) ON DELETE CASCADE,
      email text NOT NULL UNIQUE CHECK (email = lower(email)),
      name text NOT NULL,
      password_hash text,
      role text NOT NULL CHECK (role IN ('owner', 'manager', 'applicator', 'crew', 'viewer', 'admin')),
      units text NOT NULL DEFAULT 'imperial' CHECK (units IN ('imperial', 'metric')),
      time_zone text,
      calendar_token text UNIQUE,
      disabled_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((role = 'admin') = (organization_id IS NULL))
    );
    CREATE INDEX users_organization_idx ON users (organization_id);

    CREATE TABLE user_sessions (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    );
    CREATE INDEX user_sessions_expire_idx ON user_sessions (expire);

    CREATE TABLE socket_io_attachments (
      id bigserial UNIQUE,
      created_at timestamptz DEFAULT now(),
      payload bytea
    );
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP TABLE socket_io_attachments, user_sessions, users, organizations');
}

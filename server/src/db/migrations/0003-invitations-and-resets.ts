// Invitations to join an organization and password reset tokens. Only a SHA-256 hash of
// each e-mailed token is stored, so a copy of the database cannot be used to sign in.
// Sessions get an index on their user so a removed member's sessions can be ended at once.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE invitations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      email text NOT NULL CHECK (email = lower(email)),
      role text NOT NULL CHECK (role IN ('owner', 'manager', 'applicator', 'crew', 'viewer')),
      invited_by uuid REFERENCES users(id) ON DELETE SET NULL,
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX invitations_organization_idx ON invitations (organization_id);
    -- One open invitation per address and organization: inviting again replaces it.
    CREATE UNIQUE INDEX invitations_open_uq ON invitations (organization_id, email) WHERE accepted_at IS NULL AND revoked_at IS NULL;

    CREATE TABLE password_reset_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX password_reset_tokens_user_idx ON password_reset_tokens (user_id);

    CREATE INDEX user_sessions_user_idx ON user_sessions ((sess -> 'passport' ->> 'user'));
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP INDEX user_sessions_user_idx; DROP TABLE password_reset_tokens, invitations');
}

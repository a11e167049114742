// Hive requests to placements, beyond the core schema: amendments to signed agreements
// (both sides confirm), photos taken in the field, one open commitment per apiary and
// request, and the step a grower disputes.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE agreement_amendments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      agreement_id uuid NOT NULL REFERENCES agreements(id) ON DELETE CASCADE,
      state text NOT NULL DEFAULT 'proposed' CHECK (state IN ('proposed', 'accepted', 'rejected', 'withdrawn')),
      changes jsonb NOT NULL CHECK (jsonb_typeof(changes) = 'object'),
      previous jsonb NOT NULL DEFAULT '{}',
      reason text NOT NULL,
      proposed_side text NOT NULL CHECK (proposed_side IN ('farm', 'apiary')),
      proposed_by uuid REFERENCES users(id) ON DELETE SET NULL,
      decided_by uuid REFERENCES users(id) ON DELETE SET NULL,
      decided_at timestamptz,
      version_after integer,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX agreement_amendments_agreement_idx ON agreement_amendments (agreement_id, created_at);
    CREATE UNIQUE INDEX agreement_amendments_one_open ON agreement_amendments (agreement_id) WHERE state = 'proposed';

    CREATE TABLE placement_photos (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      placement_id uuid NOT NULL REFERENCES placements(id) ON DELETE CASCADE,
      step text NOT NULL CHECK (step IN ('delivery', 'strength-check', 'pickup')),
      content_type text NOT NULL CHECK (content_type IN ('image/jpeg', 'image/png', 'image/webp')),
      byte_size integer NOT NULL CHECK (byte_size > 0),
      data bytea NOT NULL,
      uploaded_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX placement_photos_placement_idx ON placement_photos (placement_id, created_at);

    ALTER TABLE placements
      ADD COLUMN dispute_step text CHECK (dispute_step IN ('delivery', 'pickup')),
      ADD COLUMN disputed_count integer CHECK (disputed_count >= 0);

    CREATE UNIQUE INDEX commitments_one_open_per_apiary ON commitments (request_id, apiary_id) WHERE state IN ('offered', 'accepted');
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP INDEX commitments_one_open_per_apiary;
    ALTER TABLE placements DROP COLUMN disputed_count, DROP COLUMN dispute_step;
    DROP TABLE placement_photos, agreement_amendments;
  `);
}

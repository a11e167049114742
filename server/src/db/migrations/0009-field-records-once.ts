// Field records sent from a phone that was offline: each request carries the phone's own
// key, and the first answer to a key is kept so a repeat gets it back without a second
// record. Beside each field step the time the phone recorded it and the time the server
// received it are kept apart (the step's own time, used by invoices and the timeline, is
// the recorded time bounded to not in the future and not before the agreement).
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE idempotency_keys (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      key text NOT NULL CHECK (length(key) BETWEEN 8 AND 200),
      method text NOT NULL,
      path text NOT NULL,
      request_hash text NOT NULL,
      response_status integer,
      response_body jsonb,
      started_at timestamptz NOT NULL DEFAULT now(),
      completed_at timestamptz,
      UNIQUE (user_id, key)
    );
    CREATE INDEX idempotency_keys_started_idx ON idempotency_keys (started_at);

    ALTER TABLE placements
      ADD COLUMN delivered_recorded_at timestamptz,
      ADD COLUMN delivered_received_at timestamptz,
      ADD COLUMN delivered_accuracy_m double precision CHECK (delivered_accuracy_m >= 0),
      ADD COLUMN picked_up_recorded_at timestamptz,
      ADD COLUMN picked_up_received_at timestamptz;
    ALTER TABLE strength_checks
      ADD COLUMN recorded_at timestamptz,
      ADD COLUMN received_at timestamptz NOT NULL DEFAULT now();
    ALTER TABLE placement_photos ADD COLUMN recorded_at timestamptz;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE placement_photos DROP COLUMN recorded_at;
    ALTER TABLE strength_checks DROP COLUMN received_at, DROP COLUMN recorded_at;
    ALTER TABLE placements DROP COLUMN picked_up_received_at, DROP COLUMN picked_up_recorded_at, DROP COLUMN delivered_accuracy_m,
      DROP COLUMN delivered_received_at, DROP COLUMN delivered_recorded_at;
    DROP TABLE idempotency_keys;
  `);
}

// Spray plans and their blocks, pheromone trap counts and the sourced pest models, and
// the conflict alerts with their history and per-organization seen state. Spray windows
// are tstzrange with GiST (btree_gist for the farm column) so the re-check that starts
// from a changed placement finds the sprays near it in the database.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE spray_plans (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      state text NOT NULL DEFAULT 'planned' CHECK (state IN ('planned', 'applied', 'cancelled')),
      planned_window tstzrange NOT NULL CHECK (NOT isempty(planned_window) AND NOT lower_inf(planned_window) AND NOT upper_inf(planned_window)),
      applied_at timestamptz,
      -- The spray itself (the planned window, or from the applied time on) extended by the
      -- residual hours (RT25, or the assumed value): kept by the sprays service.
      exposure_window tstzrange NOT NULL,
      product_name text NOT NULL CHECK (length(product_name) BETWEEN 1 AND 160),
      epa_reg_no text CHECK (epa_reg_no ~ '^[0-9]{1,7}-[0-9]{1,7}(-[0-9]{1,7})?$'),
      active_ingredients text[] NOT NULL DEFAULT '{}',
      ld50_ug_per_bee double precision CHECK (ld50_ug_per_bee >= 0),
      rt25_hours double precision CHECK (rt25_hours >= 0),
      target_pest text,
      applicator_name text,
      notes text,
      -- When the plan was last saved with this timing: the notice to beekeepers runs from here.
      noticed_at timestamptz NOT NULL,
      created_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX spray_plans_farm_window_gist ON spray_plans USING gist (farm_id, planned_window);
    CREATE INDEX spray_plans_exposure_gist ON spray_plans USING gist (exposure_window);

    CREATE TABLE spray_plan_blocks (
      spray_plan_id uuid NOT NULL REFERENCES spray_plans(id) ON DELETE CASCADE,
      block_id uuid NOT NULL REFERENCES blocks(id) ON DELETE RESTRICT,
      PRIMARY KEY (spray_plan_id, block_id)
    );
    CREATE INDEX spray_plan_blocks_block_idx ON spray_plan_blocks (block_id);

    -- Pest development models kept as data with their sources.
    CREATE TABLE pest_models (
      id text PRIMARY KEY,
      name text NOT NULL,
      lower_threshold_f double precision NOT NULL,
      upper_threshold_f double precision NOT NULL,
      method text NOT NULL CHECK (method IN ('single-sine')),
      cutoff text NOT NULL CHECK (cutoff IN ('horizontal')),
      biofix_rule text NOT NULL,
      stages jsonb NOT NULL,
      source text NOT NULL
    );
    INSERT INTO pest_models VALUES (
      'codling-moth', 'Codling moth', 50, 88, 'single-sine', 'horizontal',
      'First moth caught on two successive trap checks',
      '[{"name": "First egg hatch", "degreeDaysF": 250}, {"name": "20% egg hatch", "degreeDaysF": 350}]',
      'Michigan State Univ. Enviroweather codling moth model; Jones, Doerr and Brunner 2008 (WSU)'
    );

    CREATE TABLE pest_trap_counts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      block_id uuid NOT NULL REFERENCES blocks(id) ON DELETE CASCADE,
      pest_model_id text NOT NULL REFERENCES pest_models(id),
      checked_on date NOT NULL,
      moths integer NOT NULL CHECK (moths BETWEEN 0 AND 100000),
      recorded_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (block_id, pest_model_id, checked_on)
    );

    CREATE SEQUENCE alert_revisions;
    CREATE TABLE alerts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      spray_plan_id uuid NOT NULL REFERENCES spray_plans(id) ON DELETE CASCADE,
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      -- The affected apiary business; NULL for a finding that concerns the farm alone (bloom).
      apiary_id uuid REFERENCES organizations(id) ON DELETE CASCADE,
      state text NOT NULL DEFAULT 'raised' CHECK (state IN ('raised', 'seen', 'answered', 'resolved')),
      grade text NOT NULL,
      grades text[] NOT NULL,
      reasons jsonb NOT NULL,
      findings jsonb NOT NULL,
      -- Rises on every change, so a reconnecting client asks for everything after the last it saw.
      revision bigint NOT NULL DEFAULT nextval('alert_revisions'),
      raised_at timestamptz NOT NULL,
      resolved_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX alerts_spray_apiary_unique ON alerts (spray_plan_id, coalesce(apiary_id, '00000000-0000-0000-0000-000000000000'::uuid));
    CREATE INDEX alerts_farm_revision_idx ON alerts (farm_id, revision);
    CREATE INDEX alerts_apiary_revision_idx ON alerts (apiary_id, revision);

    CREATE TABLE alert_events (
      id bigserial PRIMARY KEY,
      alert_id uuid NOT NULL REFERENCES alerts(id) ON DELETE CASCADE,
      action text NOT NULL CHECK (action IN ('raised', 'updated', 'seen', 'answered', 'resolved', 'reopened')),
      actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
      organization_id uuid REFERENCES organizations(id) ON DELETE SET NULL,
      response text,
      note text,
      detail jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX alert_events_alert_idx ON alert_events (alert_id, id);

    CREATE TABLE alert_views (
      alert_id uuid NOT NULL REFERENCES alerts(id) ON DELETE CASCADE,
      organization_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      seen_by uuid REFERENCES users(id) ON DELETE SET NULL,
      seen_at timestamptz NOT NULL,
      PRIMARY KEY (alert_id, organization_id)
    );

    -- The conflict search goes from drop sites to the agreements of their request.
    CREATE INDEX IF NOT EXISTS agreements_request_idx ON agreements (request_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`DROP INDEX IF EXISTS agreements_request_idx;
    DROP TABLE alert_views, alert_events, alerts, pest_trap_counts, pest_models, spray_plan_blocks, spray_plans;
    DROP SEQUENCE alert_revisions`);
}

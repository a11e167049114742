// The season's core: blocks and their bloom windows, beekeepers' yards, hive requests
// with drop sites, commitments, agreements, placements and strength checks. Time windows
// are tstzrange and places are PostGIS geometry (SRID 4326), both GiST-indexed, so the
// spray conflict search can run in the database.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE blocks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
      crop text NOT NULL,
      variety text,
      pollinizer_variety text,
      year_planted integer CHECK (year_planted BETWEEN 1900 AND 2100),
      trees_per_acre double precision CHECK (trees_per_acre > 0),
      notes text,
      outline geometry(Polygon, 4326),
      location geometry(Point, 4326),
      entered_acres double precision CHECK (entered_acres > 0),
      area_m2 double precision NOT NULL CHECK (area_m2 > 0),
      colonies_per_acre double precision NOT NULL CHECK (colonies_per_acre >= 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (farm_id, name)
    );
    CREATE INDEX blocks_farm_idx ON blocks (farm_id);
    CREATE INDEX blocks_outline_gist ON blocks USING gist (outline);
    CREATE INDEX blocks_location_gist ON blocks USING gist (location);

    -- Every revision of a block's published bloom window is kept; the newest per season is current.
    CREATE TABLE bloom_windows (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      block_id uuid NOT NULL REFERENCES blocks(id) ON DELETE CASCADE,
      season integer NOT NULL,
      bloom_start date NOT NULL,
      full_bloom date,
      petal_fall date NOT NULL,
      confidence_note text,
      revised_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      CHECK (bloom_start <= petal_fall),
      CHECK (full_bloom IS NULL OR (full_bloom BETWEEN bloom_start AND petal_fall))
    );
    CREATE INDEX bloom_windows_block_idx ON bloom_windows (block_id, season, created_at DESC);
    CREATE VIEW current_bloom_windows AS
      SELECT DISTINCT ON (block_id, season) *
      FROM bloom_windows ORDER BY block_id, season, created_at DESC, id DESC;

    CREATE TABLE yards (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      name text NOT NULL,
      location geometry(Point, 4326) NOT NULL,
      colonies integer CHECK (colonies >= 0),
      notes text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX yards_apiary_idx ON yards (apiary_id);
    CREATE INDEX yards_location_gist ON yards USING gist (location);

    CREATE TABLE hive_requests (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      title text NOT NULL,
      state text NOT NULL DEFAULT 'draft' CHECK (state IN ('draft', 'listed', 'filled', 'closed', 'withdrawn')),
      colonies_requested integer NOT NULL CHECK (colonies_requested > 0),
      min_frames_of_bees double precision NOT NULL CHECK (min_frames_of_bees >= 0),
      min_frames_of_brood double precision CHECK (min_frames_of_brood >= 0),
      arrive_rule text NOT NULL CHECK (arrive_rule IN ('bloom-stage', 'date')),
      arrive_bloom_percent integer CHECK (arrive_bloom_percent BETWEEN 0 AND 100),
      arrive_on date,
      depart_rule text NOT NULL CHECK (depart_rule IN ('petal-fall', 'date')),
      depart_on date,
      expected_on_site tstzrange,
      price_per_colony_cents integer NOT NULL CHECK (price_per_colony_cents >= 0),
      currency char(3) NOT NULL DEFAULT 'USD',
      deposit_share_bp integer NOT NULL DEFAULT 5000 CHECK (deposit_share_bp BETWEEN 0 AND 10000),
      balance_due_days integer NOT NULL DEFAULT 30 CHECK (balance_due_days BETWEEN 0 AND 365),
      late_interest_bp_per_month integer NOT NULL DEFAULT 100 CHECK (late_interest_bp_per_month BETWEEN 0 AND 2000),
      below_minimum_rate_bp integer NOT NULL DEFAULT 0 CHECK (below_minimum_rate_bp BETWEEN 0 AND 10000),
      extra_move_fee_cents integer NOT NULL DEFAULT 0 CHECK (extra_move_fee_cents >= 0),
      notice_hours integer NOT NULL DEFAULT 48 CHECK (notice_hours BETWEEN 0 AND 720),
      respond_by date,
      notes text,
      created_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX hive_requests_farm_idx ON hive_requests (farm_id);
    CREATE INDEX hive_requests_state_idx ON hive_requests (state);

    CREATE TABLE hive_request_blocks (
      request_id uuid NOT NULL REFERENCES hive_requests(id) ON DELETE CASCADE,
      block_id uuid NOT NULL REFERENCES blocks(id) ON DELETE RESTRICT,
      colonies integer NOT NULL CHECK (colonies > 0),
      PRIMARY KEY (request_id, block_id)
    );
    CREATE INDEX hive_request_blocks_block_idx ON hive_request_blocks (block_id);

    CREATE TABLE drop_sites (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      request_id uuid NOT NULL REFERENCES hive_requests(id) ON DELETE CASCADE,
      block_id uuid NOT NULL REFERENCES blocks(id) ON DELETE RESTRICT,
      name text NOT NULL,
      location geometry(Point, 4326) NOT NULL,
      colonies_planned integer NOT NULL CHECK (colonies_planned > 0),
      access_notes text,
      vehicle_access text,
      gate_code text,
      water_source text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX drop_sites_request_idx ON drop_sites (request_id);
    CREATE INDEX drop_sites_location_gist ON drop_sites USING gist (location);
    CREATE INDEX drop_sites_location_geog_gist ON drop_sites USING gist ((location::geography));

    CREATE TABLE hive_request_events (
      id bigserial PRIMARY KEY,
      request_id uuid NOT NULL REFERENCES hive_requests(id) ON DELETE CASCADE,
      actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
      action text NOT NULL,
      detail jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX hive_request_events_request_idx ON hive_request_events (request_id, id);

    CREATE TABLE commitments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      request_id uuid NOT NULL REFERENCES hive_requests(id) ON DELETE CASCADE,
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      colonies integer NOT NULL CHECK (colonies > 0),
      proposed_price_cents integer CHECK (proposed_price_cents >= 0),
      state text NOT NULL DEFAULT 'offered' CHECK (state IN ('offered', 'accepted', 'declined', 'withdrawn')),
      note text,
      created_by uuid REFERENCES users(id) ON DELETE SET NULL,
      decided_by uuid REFERENCES users(id) ON DELETE SET NULL,
      decided_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX commitments_request_idx ON commitments (request_id);
    CREATE INDEX commitments_apiary_idx ON commitments (apiary_id);

    CREATE TABLE agreements (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      commitment_id uuid NOT NULL UNIQUE REFERENCES commitments(id) ON DELETE RESTRICT,
      request_id uuid NOT NULL REFERENCES hive_requests(id) ON DELETE RESTRICT,
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE RESTRICT,
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE RESTRICT,
      state text NOT NULL DEFAULT 'awaiting-signatures'
        CHECK (state IN ('awaiting-signatures', 'in-force', 'completed', 'cancelled')),
      version integer NOT NULL DEFAULT 1,
      colonies integer NOT NULL CHECK (colonies > 0),
      price_per_colony_cents integer NOT NULL CHECK (price_per_colony_cents >= 0),
      currency char(3) NOT NULL,
      min_frames_of_bees double precision NOT NULL,
      min_frames_of_brood double precision,
      expected_on_site tstzrange NOT NULL,
      notice_hours integer NOT NULL,
      removal_notice_hours integer NOT NULL DEFAULT 48,
      deposit_share_bp integer NOT NULL,
      balance_due_days integer NOT NULL,
      late_interest_bp_per_month integer NOT NULL,
      below_minimum_rate_bp integer NOT NULL,
      extra_move_fee_cents integer NOT NULL,
      clauses jsonb NOT NULL DEFAULT '[]',
      farm_confirmed_by uuid REFERENCES users(id) ON DELETE SET NULL,
      farm_confirmed_at timestamptz,
      apiary_confirmed_by uuid REFERENCES users(id) ON DELETE SET NULL,
      apiary_confirmed_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX agreements_farm_idx ON agreements (farm_id);
    CREATE INDEX agreements_apiary_idx ON agreements (apiary_id);
    CREATE INDEX agreements_on_site_gist ON agreements USING gist (expected_on_site);

    CREATE TABLE placements (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      agreement_id uuid NOT NULL REFERENCES agreements(id) ON DELETE CASCADE,
      drop_site_id uuid NOT NULL REFERENCES drop_sites(id) ON DELETE RESTRICT,
      state text NOT NULL DEFAULT 'scheduled' CHECK (state IN ('scheduled', 'delivered', 'picked-up')),
      colonies_planned integer NOT NULL CHECK (colonies_planned > 0),
      -- When colonies are (or are expected to be) on site: the agreement window until
      -- delivery, then [delivered_at, picked_up_at). Kept by the placements service.
      on_site tstzrange NOT NULL,
      colonies_delivered integer CHECK (colonies_delivered >= 0),
      delivered_at timestamptz,
      delivered_location geometry(Point, 4326),
      delivered_by uuid REFERENCES users(id) ON DELETE SET NULL,
      colonies_picked_up integer CHECK (colonies_picked_up >= 0),
      picked_up_at timestamptz,
      picked_up_by uuid REFERENCES users(id) ON DELETE SET NULL,
      dispute_note text,
      disputed_by uuid REFERENCES users(id) ON DELETE SET NULL,
      disputed_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX placements_agreement_idx ON placements (agreement_id);
    CREATE INDEX placements_drop_site_idx ON placements (drop_site_id);
    CREATE INDEX placements_on_site_gist ON placements USING gist (drop_site_id, on_site);

    CREATE TABLE strength_checks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      placement_id uuid NOT NULL REFERENCES placements(id) ON DELETE CASCADE,
      checked_at timestamptz NOT NULL,
      checked_by uuid REFERENCES users(id) ON DELETE SET NULL,
      inspector_name text,
      colonies_in_group integer NOT NULL CHECK (colonies_in_group > 0),
      frames_of_bees double precision[] NOT NULL,
      frames_of_brood double precision[],
      notes text,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX strength_checks_placement_idx ON strength_checks (placement_id);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`DROP TABLE strength_checks, placements, agreements, commitments, hive_request_events,
    drop_sites, hive_request_blocks, hive_requests, yards; DROP VIEW current_bloom_windows;
    DROP TABLE bloom_windows, blocks`);
}

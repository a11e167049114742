// Blocks, weather and bloom forecasts beyond the core schema: farms' weather stations
// with daily minimum/maximum temperatures (°C) and forecast lows, each block's station and
// degree-day start (a start date or a biofix), crop stage thresholds in degree days and
// frost critical temperatures of flower buds (both editable, seeded with published values
// and labelled with their source), and what each apiary's bloom-window digest has covered.
import type { MigrationContext } from '../migrator.js';
import { insertPublishedReference } from '../../modules/bloom/published-reference.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    CREATE TABLE weather_stations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
      location geometry(Point, 4326) NOT NULL,
      time_zone text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (farm_id, name)
    );
    CREATE INDEX weather_stations_farm_idx ON weather_stations (farm_id);
    CREATE INDEX weather_stations_location_gist ON weather_stations USING gist (location);

    CREATE TABLE daily_temperatures (
      station_id uuid NOT NULL REFERENCES weather_stations(id) ON DELETE CASCADE,
      day date NOT NULL,
      tmin_c double precision NOT NULL CHECK (tmin_c BETWEEN -60 AND 60),
      tmax_c double precision NOT NULL CHECK (tmax_c BETWEEN -60 AND 60),
      source text NOT NULL DEFAULT 'manual' CHECK (source IN ('upload', 'manual')),
      entered_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (station_id, day),
      CHECK (tmin_c <= tmax_c)
    );

    CREATE TABLE forecast_lows (
      station_id uuid NOT NULL REFERENCES weather_stations(id) ON DELETE CASCADE,
      day date NOT NULL,
      low_c double precision NOT NULL CHECK (low_c BETWEEN -60 AND 60),
      entered_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (station_id, day)
    );

    ALTER TABLE blocks
      ADD COLUMN weather_station_id uuid REFERENCES weather_stations(id) ON DELETE SET NULL,
      ADD COLUMN degree_day_start date;
    CREATE INDEX blocks_weather_station_idx ON blocks (weather_station_id);

    -- Degree-day stage thresholds. farm_id NULL: the published defaults (platform admin
    -- edits); a farm's own rows (per crop and optionally variety) take precedence.
    CREATE TABLE crop_stage_thresholds (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid REFERENCES organizations(id) ON DELETE CASCADE,
      crop text NOT NULL,
      variety text,
      stage text NOT NULL CHECK (stage ~ '^[a-z][a-z-]*$'),
      label text NOT NULL,
      sort_order integer NOT NULL DEFAULT 0,
      base_f double precision NOT NULL,
      upper_f double precision,
      method text NOT NULL DEFAULT 'average' CHECK (method IN ('average', 'triangle', 'sine')),
      start_month_day char(5) NOT NULL DEFAULT '03-01' CHECK (start_month_day ~ '^[01][0-9]-[0-3][0-9]$'),
      dd_low_f double precision NOT NULL CHECK (dd_low_f >= 0),
      dd_high_f double precision NOT NULL,
      source text NOT NULL,
      updated_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK (dd_high_f >= dd_low_f),
      CHECK (upper_f IS NULL OR upper_f > base_f)
    );
    CREATE UNIQUE INDEX crop_stage_thresholds_uq
      ON crop_stage_thresholds (coalesce(farm_id, '00000000-0000-0000-0000-000000000000'::uuid), crop, coalesce(variety, ''), stage);

    -- Critical temperatures of flower buds, in °F as published (10% and 90% kill, held 30 minutes).
    CREATE TABLE frost_critical_temperatures (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      crop text NOT NULL,
      stage_label text NOT NULL,
      stage text,
      sort_order integer NOT NULL,
      kill10_f double precision NOT NULL,
      kill90_f double precision NOT NULL,
      source text NOT NULL,
      updated_by uuid REFERENCES users(id) ON DELETE SET NULL,
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (crop, stage_label),
      CHECK (kill90_f <= kill10_f)
    );

    -- Up to when each apiary's e-mail digest of bloom-window revisions has reported.
    CREATE TABLE bloom_digest_marks (
      apiary_id uuid PRIMARY KEY REFERENCES organizations(id) ON DELETE CASCADE,
      reported_through timestamptz NOT NULL
    );
  `);
  await insertPublishedReference(sequelize);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`
    DROP TABLE bloom_digest_marks, frost_critical_temperatures, crop_stage_thresholds;
    ALTER TABLE blocks DROP COLUMN weather_station_id, DROP COLUMN degree_day_start;
    DROP TABLE forecast_lows, daily_temperatures, weather_stations;
  `);
}

// The conflict search in PostgreSQL, which the ORM cannot say: colonies placed or expected
// on the sprayed blocks or at drop sites within the farm's buffer (ST_DWithin on geography,
// GiST), on site during the spray window extended by the residual time (tstzrange &&, GiST),
// whether the sprayed blocks bloom in that window, and which sprays a changed block or
// agreement may touch. Bind parameters only; pass the caller's transaction.
import type { Sequelize, Transaction } from 'sequelize';
import { prepareStatement, queryPrepared, queryRows } from '../../db/query-rows.js';

export interface SearchScope {
  farmId: string;
  blockIds: string[];
  /** The spray itself. */
  from: Date;
  to: Date;
  /** End of the spray extended by the residual hours. */
  exposureTo: Date;
  bufferM: number;
}

/** Colonies at one drop site under one agreement, placed or expected: one row per drop site and agreement. */
export interface ExposureRow {
  drop_site_id: string;
  drop_site_name: string;
  block_name: string;
  lon: number;
  lat: number;
  distance_m: number;
  on_sprayed_block: boolean;
  agreement_id: string;
  agreement_state: string;
  apiary_id: string;
  apiary_name: string;
  notice_hours: number;
  colonies: number;
  placed: boolean;
  during_spray: boolean;
}

export interface SprayedBlockRow {
  id: string;
  name: string;
  outline: string | null;
  lon: number;
  lat: number;
}

const searchSql = `
  WITH sprayed AS (
    SELECT b.id, b.name, b.farm_id, coalesce(b.outline, b.location) AS geom
    FROM blocks b WHERE b.id = ANY($blockIds::uuid[]) AND b.farm_id = $farmId
  ),
  near_sites AS (
    -- The buffer test is on the spheroid; the distance shown is on the sphere (within 0.5 %, and cheaper).
    SELECT DISTINCT ON (d.id) d.id, d.request_id, d.name, d.block_id, d.colonies_planned, d.location, x.distance_m
    FROM sprayed s JOIN drop_sites d ON ST_DWithin(d.location::geography, s.geom::geography, $bufferM),
      LATERAL (SELECT ST_Distance(d.location::geography, s.geom::geography, false) AS distance_m) x
    ORDER BY d.id, x.distance_m
  ),
  placed AS (
    -- Summed per drop site, agreement and delivered-or-not before anything else is joined, so
    -- what follows (and what the check receives) grows with the drop sites near the spray, not
    -- with the placements on them.
    SELECT p.drop_site_id, p.agreement_id, p.state <> 'scheduled' AS placed,
      sum(coalesce(p.colonies_delivered, p.colonies_planned)) AS colonies,
      bool_or(p.on_site && tstzrange($from, $to, '[)')) AS during_spray
    FROM near_sites n
    JOIN placements p ON p.drop_site_id = n.id AND p.on_site && tstzrange($from, $exposureTo, '[)')
    GROUP BY p.drop_site_id, p.agreement_id, p.state <> 'scheduled'
  ),
  unscheduled AS MATERIALIZED (
    -- Agreements with no placement yet, looked up once per request near the spray, not once per drop site.
    -- By request (OFFSET 0 keeps the lookup apart), never by the window: every agreement of the season overlaps it.
    SELECT a.id, a.request_id, a.state, a.apiary_id, a.notice_hours, a.colonies, a.expected_on_site && tstzrange($from, $to, '[)') AS during_spray
    FROM (SELECT DISTINCT request_id FROM near_sites) r
    CROSS JOIN LATERAL (
      SELECT a.* FROM agreements a WHERE a.request_id = r.request_id AND a.state IN ('awaiting-signatures', 'in-force')
        AND a.expected_on_site && tstzrange($from, $exposureTo, '[)') OFFSET 0
    ) a
    WHERE NOT EXISTS (SELECT 1 FROM placements p WHERE p.agreement_id = a.id)
  ),
  found AS (
    SELECT x.drop_site_id, a.id AS agreement_id, a.state AS agreement_state, a.apiary_id, a.notice_hours,
      sum(x.colonies) AS colonies, bool_or(x.placed) AS placed, bool_or(x.during_spray) AS during_spray
    FROM placed x
    -- Each agreement looked up by its key (OFFSET 0 keeps the lookup apart): in a dense season
    -- the planner would otherwise read the whole agreements table into a hash.
    CROSS JOIN LATERAL (SELECT a.id, a.state, a.apiary_id, a.notice_hours FROM agreements a WHERE a.id = x.agreement_id OFFSET 0) a
    WHERE x.placed OR a.state IN ('awaiting-signatures', 'in-force')
    GROUP BY x.drop_site_id, a.id, a.state, a.apiary_id, a.notice_hours
    UNION ALL
    -- Agreed but not yet scheduled: the agreement's window at its request's drop sites.
    SELECT n.id, u.id, u.state, u.apiary_id, u.notice_hours, least(u.colonies, n.colonies_planned), false, u.during_spray
    FROM unscheduled u JOIN near_sites n ON n.request_id = u.request_id
  ),
  exposures AS (
    SELECT f.drop_site_id, n.name AS drop_site_name, b.name AS block_name, ST_X(n.location) AS lon, ST_Y(n.location) AS lat,
      n.distance_m, (n.block_id IN (SELECT id FROM sprayed)) AS on_sprayed_block,
      f.agreement_id, f.agreement_state, f.apiary_id, o.name AS apiary_name, f.notice_hours, f.colonies, f.placed, f.during_spray
    FROM found f
    JOIN near_sites n ON n.id = f.drop_site_id
    JOIN blocks b ON b.id = n.block_id
    JOIN organizations o ON o.id = f.apiary_id
  )
  SELECT
    (SELECT coalesce(json_agg(json_build_object(
        'id', s.id, 'name', s.name, 'outline', ST_AsGeoJSON(s.geom), 'lon', ST_X(ST_Centroid(s.geom)), 'lat', ST_Y(ST_Centroid(s.geom))
      ) ORDER BY s.name), '[]') FROM sprayed s) AS blocks,
    EXISTS (
      -- block_id = ANY(...) rather than a join, so the view's latest-window search is by block.
      SELECT 1 FROM current_bloom_windows w
      JOIN sprayed s ON s.id = w.block_id
      JOIN organizations o ON o.id = s.farm_id
      WHERE w.block_id = ANY($blockIds::uuid[]) AND tstzrange((w.bloom_start::timestamp AT TIME ZONE o.time_zone), ((w.petal_fall + 1)::timestamp AT TIME ZONE o.time_zone), '[)')
          && tstzrange($from, $exposureTo, '[)')
    ) AS during_bloom,
    (SELECT coalesce(json_agg(e ORDER BY e.apiary_name, e.distance_m, e.drop_site_id, e.agreement_id), '[]') FROM exposures e) AS exposures`;

/** The search, prepared once per connection: it runs on every save, and its plan does not depend on the values. */
const searchStatement = prepareStatement('conflict-search', searchSql);

/** The search's SQL, for the benchmark's EXPLAIN (bind parameters $farmId, $blockIds, $from, $to, $exposureTo, $bufferM). */
export const conflictSearchSqlForExplain = searchSql;

export function searchBind(scope: SearchScope) {
  return { farmId: scope.farmId, blockIds: scope.blockIds, from: scope.from, to: scope.to, exposureTo: scope.exposureTo, bufferM: scope.bufferM };
}

type Tx = Transaction | null | undefined;

export interface ConflictSearch {
  blocks: SprayedBlockRow[];
  exposures: ExposureRow[];
  duringBloom: boolean;
}

/**
 * The whole search in one statement (one round trip, planned once per connection): the sprayed
 * blocks, whether they bloom in the exposure window, and the colonies exposed, grouped per
 * drop site and agreement.
 */
export async function searchConflicts(sequelize: Sequelize, scope: SearchScope, transaction?: Tx): Promise<ConflictSearch> {
  const [row] = await queryPrepared<{ blocks: SprayedBlockRow[]; during_bloom: boolean; exposures: ExposureRow[] }>(sequelize, searchStatement, searchBind(scope), transaction);
  return {
    blocks: row?.blocks ?? [],
    duringBloom: Boolean(row?.during_bloom),
    // json_agg gives numbers as JSON numbers, so the rows need no conversion.
    exposures: row?.exposures ?? [],
  };
}

/** Sprays not cancelled and not yet over that cover one of these blocks (a bloom window changed). */
export async function spraysOnBlocks(sequelize: Sequelize, blockIds: string[], now: Date, transaction?: Tx): Promise<string[]> {
  const rows = await queryRows<{ id: string }>(
    sequelize,
    `SELECT DISTINCT s.id FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
     WHERE sb.block_id = ANY($blockIds::uuid[]) AND s.state <> 'cancelled' AND upper(s.exposure_window) > $now`,
    { bind: { blockIds, now }, transaction },
  );
  return rows.map((r) => r.id);
}

/**
 * Sprays that may touch an agreement's colonies (a placement or the agreement changed):
 * sprays whose blocks lie within their farm's buffer of the agreement's drop sites, and
 * sprays that already have an open alert for its apiary business.
 */
export async function spraysNearAgreement(sequelize: Sequelize, agreementId: string, now: Date, transaction?: Tx): Promise<string[]> {
  const rows = await queryRows<{ id: string }>(
    sequelize,
    `SELECT s.id FROM agreements a
       JOIN drop_sites d ON d.request_id = a.request_id
       JOIN spray_plans s ON s.state <> 'cancelled' AND upper(s.exposure_window) > $now
       JOIN organizations o ON o.id = s.farm_id
       JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
       JOIN blocks b ON b.id = sb.block_id
     WHERE a.id = $agreementId AND ST_DWithin(d.location::geography, coalesce(b.outline, b.location)::geography, o.spray_buffer_m)
     UNION
     SELECT al.spray_plan_id FROM agreements a JOIN alerts al ON al.apiary_id = a.apiary_id AND al.state <> 'resolved' WHERE a.id = $agreementId`,
    { bind: { agreementId, now }, transaction },
  );
  return rows.map((r) => r.id);
}

// The season overviews' SQL: sums over blocks, placements, commitments and invoices,
// range overlaps with the season window, and PostGIS output for the map. Values travel as
// replacements or bind parameters; the only text chosen in code is which side's column or
// visibility rule a query reads (farm or apiary), never a value. The overviews are asked for
// on every visit, so their statements are prepared (planned once per connection).
import type { Sequelize } from 'sequelize';
import { prepareStatement, queryOne, queryPrepared, queryRows } from '../../db/query-rows.js';

type Side = 'farm' | 'apiary';
/** The season window and the moment the overview is drawn for (ISO strings). */
export type SeasonWindow = { from: string; to: string; now: string };

const SQUARE_METRES_PER_ACRE = 4046.8564224;
/** An id that matches nothing, so `IN (:ids)` stays valid for an empty list. */
const NO_IDS = ['00000000-0000-0000-0000-000000000000'];
const idsOrNone = (ids: string[]) => (ids.length ? ids : NO_IDS);
const sideColumn = (side: Side) => (side === 'farm' ? 'farm_id' : 'apiary_id');

/** Blocks a farm owns; for a beekeeper, blocks of requests the business has an accepted commitment on. */
function visibleBlocks(kind: Side) {
  return kind === 'farm'
    ? 'b.farm_id = :orgId'
    : `b.id IN (SELECT hrb.block_id FROM hive_request_blocks hrb JOIN commitments c ON c.request_id = hrb.request_id
         WHERE c.apiary_id = :orgId AND c.state = 'accepted'
         UNION SELECT d.block_id FROM drop_sites d JOIN placements p ON p.drop_site_id = d.id JOIN agreements a ON a.id = p.agreement_id WHERE a.apiary_id = :orgId)`;
}

// The grower's overview, in parts (one statement below runs them all).
const growerBlocksSql = `
  SELECT b.id, b.name, b.crop, b.area_m2 / $squareMetresPerAcre::float8 AS acres, b.colonies_per_acre,
    bw.bloom_start::text AS bloom_start, bw.full_bloom::text AS full_bloom, bw.petal_fall::text AS petal_fall,
    coalesce(p.planned, 0)::int AS planned, coalesce(p.on_site, 0)::int AS on_site
  FROM blocks b
  LEFT JOIN current_bloom_windows bw ON bw.block_id = b.id AND bw.season = $season::int
  LEFT JOIN LATERAL (
    SELECT sum(pl.colonies_planned) AS planned,
           sum(coalesce(pl.colonies_delivered, 0)) FILTER (WHERE pl.state = 'delivered' AND pl.on_site @> $now::timestamptz) AS on_site
    FROM drop_sites d
    JOIN placements pl ON pl.drop_site_id = d.id
    JOIN agreements a ON a.id = pl.agreement_id AND a.state <> 'cancelled'
    WHERE d.block_id = b.id AND pl.on_site && tstzrange($from::timestamptz, $to::timestamptz, '[)')
  ) p ON true
  WHERE b.farm_id = $farmId::uuid
  ORDER BY b.name`;

const growerColonySumsSql = `
  SELECT
    (SELECT coalesce(sum(hrb.colonies), 0)::int FROM hive_requests r JOIN hive_request_blocks hrb ON hrb.request_id = r.id
      WHERE r.farm_id = $farmId::uuid AND r.state IN ('listed', 'filled', 'closed')
        AND (r.expected_on_site IS NULL OR r.expected_on_site && tstzrange($from::timestamptz, $to::timestamptz, '[)'))) AS requested,
    (SELECT coalesce(sum(coalesce(a.colonies, c.colonies)), 0)::int FROM commitments c
      JOIN hive_requests r ON r.id = c.request_id
      LEFT JOIN agreements a ON a.commitment_id = c.id
      WHERE r.farm_id = $farmId::uuid AND c.state = 'accepted' AND (a.id IS NULL OR a.state <> 'cancelled')
        AND coalesce(a.expected_on_site, r.expected_on_site, tstzrange($from::timestamptz, $to::timestamptz, '[)'))
          && tstzrange($from::timestamptz, $to::timestamptz, '[)')) AS committed`;

// Accepted commitments count from the request's window until the agreement sets its own.
const committedSql = `
  SELECT coalesce(a.colonies, c.colonies) AS colonies, r.farm_id, coalesce(a.expected_on_site, r.expected_on_site) AS on_site
  FROM commitments c
  JOIN hive_requests r ON r.id = c.request_id
  LEFT JOIN agreements a ON a.commitment_id = c.id
  WHERE c.apiary_id = :apiaryId AND c.state = 'accepted' AND (a.id IS NULL OR a.state <> 'cancelled')
    AND coalesce(a.expected_on_site, r.expected_on_site) && tstzrange(:from, :to, '[)')`;

/** First and last moment the beekeeper has colonies committed within the season. */
export async function selectCommittedSpan(sequelize: Sequelize, p: SeasonWindow & { apiaryId: string }) {
  const row = await queryOne<{ first: string | null; last: string | null }>(
    sequelize,
    `SELECT min(greatest(lower(on_site), :from::timestamptz)) AS first, max(least(upper(on_site), :to::timestamptz)) AS last FROM (${committedSql}) x`,
    { replacements: p },
  );
  return row!;
}

/** Colonies committed per week (weeks starting on the given local dates) and farm. */
export function selectCommittedWeeks(sequelize: Sequelize, p: SeasonWindow & { apiaryId: string; tz: string; weeks: string[] }) {
  return queryRows<{ week_start: string; farm_id: string; farm_name: string; colonies: number }>(
    sequelize,
    `SELECT wk.week_start::text AS week_start, x.farm_id, o.name AS farm_name, sum(x.colonies)::int AS colonies
     FROM unnest(ARRAY[:weeks]::date[]) AS wk(week_start)
     JOIN (${committedSql}) x
       ON x.on_site && tstzrange(wk.week_start::timestamp AT TIME ZONE :tz, (wk.week_start + 7)::timestamp AT TIME ZONE :tz, '[)')
     JOIN organizations o ON o.id = x.farm_id
     GROUP BY wk.week_start, x.farm_id, o.name
     ORDER BY wk.week_start, o.name`,
    { replacements: { ...p, weeks: p.weeks.length ? p.weeks : ['1970-01-05'] } },
  );
}

/** Drop-offs and pickups of the beekeeper due before the horizon. */
export function selectMovesDue(sequelize: Sequelize, p: { apiaryId: string; horizon: string }) {
  return queryRows<{
    placement_id: string; agreement_id: string; farm_name: string; drop_site_name: string; block_name: string; colonies: number; due_at: Date; kind: 'drop-off' | 'pickup';
  }>(
    sequelize,
    `SELECT p.id AS placement_id, a.id AS agreement_id, o.name AS farm_name, d.name AS drop_site_name, b.name AS block_name,
       CASE WHEN p.state = 'scheduled' THEN p.colonies_planned ELSE coalesce(p.colonies_delivered, p.colonies_planned) END AS colonies,
       CASE WHEN p.state = 'scheduled' THEN lower(p.on_site) ELSE upper(a.expected_on_site) END AS due_at,
       CASE WHEN p.state = 'scheduled' THEN 'drop-off' ELSE 'pickup' END AS kind
     FROM placements p
     JOIN agreements a ON a.id = p.agreement_id AND a.apiary_id = :apiaryId AND a.state IN ('awaiting-signatures', 'in-force')
     JOIN drop_sites d ON d.id = p.drop_site_id
     JOIN blocks b ON b.id = d.block_id
     JOIN organizations o ON o.id = a.farm_id
     WHERE (p.state = 'scheduled' AND lower(p.on_site) < :horizon::timestamptz)
        OR (p.state = 'delivered' AND upper(a.expected_on_site) < :horizon::timestamptz)
     ORDER BY due_at, o.name, d.name`,
    { replacements: p },
  );
}

export function selectTimelineBlocks(sequelize: Sequelize, kind: Side, orgId: string) {
  return queryRows<{ id: string; name: string; crop: string; farm_name: string }>(
    sequelize,
    `SELECT b.id, b.name, b.crop, o.name AS farm_name FROM blocks b JOIN organizations o ON o.id = b.farm_id
     WHERE ${visibleBlocks(kind)} ORDER BY o.name, b.name`,
    { replacements: { orgId } },
  );
}

export function selectTimelineBloom(sequelize: Sequelize, p: { season: number; tz: string; ids: string[] }) {
  return queryRows<{ block_id: string; id: string; start: Date; end: Date; full_bloom: string | null }>(
    sequelize,
    `SELECT bw.block_id, bw.id, bw.bloom_start::timestamp AT TIME ZONE :tz AS start,
       (bw.petal_fall + 1)::timestamp AT TIME ZONE :tz AS "end", bw.full_bloom::text AS full_bloom
     FROM current_bloom_windows bw WHERE bw.season = :season AND bw.block_id IN (:ids)`,
    { replacements: { ...p, ids: idsOrNone(p.ids) } },
  );
}

export function selectTimelinePlacements(sequelize: Sequelize, kind: Side, p: SeasonWindow & { orgId: string; ids: string[] }) {
  return queryRows<{ block_id: string; id: string; agreement_id: string; start: Date | null; end: Date | null; state: string; colonies: number; site: string }>(
    sequelize,
    `SELECT d.block_id, p.id, p.agreement_id, lower(p.on_site) AS start,
       CASE WHEN upper_inf(p.on_site) THEN upper(a.expected_on_site) ELSE upper(p.on_site) END AS "end",
       p.state, coalesce(p.colonies_delivered, p.colonies_planned) AS colonies, d.name AS site
     FROM placements p JOIN drop_sites d ON d.id = p.drop_site_id JOIN agreements a ON a.id = p.agreement_id AND a.state <> 'cancelled'
     WHERE d.block_id IN (:ids) AND p.on_site && tstzrange(:from, :to, '[)')
       ${kind === 'apiary' ? 'AND a.apiary_id = :orgId' : ''}`,
    { replacements: { ...p, ids: idsOrNone(p.ids) } },
  );
}

export function selectMapBlocks(sequelize: Sequelize, kind: Side, p: { orgId: string; season: number }) {
  return queryRows<{ id: string; name: string; crop: string; geometry: string; bloom_start: string | null; petal_fall: string | null; farm_name: string }>(
    sequelize,
    `SELECT b.id, b.name, b.crop, ST_AsGeoJSON(coalesce(b.outline, b.location), 6) AS geometry, o.name AS farm_name,
       bw.bloom_start::text AS bloom_start, bw.petal_fall::text AS petal_fall
     FROM blocks b JOIN organizations o ON o.id = b.farm_id
     LEFT JOIN current_bloom_windows bw ON bw.block_id = b.id AND bw.season = :season
     WHERE ${visibleBlocks(kind)} AND coalesce(b.outline, b.location) IS NOT NULL ORDER BY b.name`,
    { replacements: p },
  );
}

export function selectMapDropSites(sequelize: Sequelize, kind: Side, p: SeasonWindow & { orgId: string }) {
  return queryRows<{ id: string; name: string; geometry: string; block_name: string; planned: number; on_site: number; scheduled: number }>(
    sequelize,
    `SELECT d.id, d.name, ST_AsGeoJSON(d.location, 6) AS geometry, b.name AS block_name, d.colonies_planned AS planned,
       coalesce(sum(coalesce(p.colonies_delivered, 0)) FILTER (WHERE p.state = 'delivered'), 0)::int AS on_site,
       count(p.id) FILTER (WHERE p.state = 'scheduled')::int AS scheduled
     FROM drop_sites d JOIN blocks b ON b.id = d.block_id JOIN hive_requests r ON r.id = d.request_id
     LEFT JOIN placements p ON p.drop_site_id = d.id
       AND p.agreement_id IN (SELECT a.id FROM agreements a WHERE a.state <> 'cancelled' ${kind === 'apiary' ? 'AND a.apiary_id = :orgId' : ''})
       AND p.on_site && tstzrange(:from, :to, '[)')
     WHERE ${kind === 'farm' ? 'r.farm_id = :orgId' : `EXISTS (SELECT 1 FROM commitments c WHERE c.request_id = r.id AND c.apiary_id = :orgId AND c.state = 'accepted')`}
       AND r.state <> 'withdrawn'
     GROUP BY d.id, b.name ORDER BY d.name`,
    { replacements: p },
  );
}

export function selectMapYards(sequelize: Sequelize, apiaryId: string) {
  return queryRows<{ id: string; name: string; geometry: string; colonies: number | null }>(
    sequelize,
    'SELECT y.id, y.name, ST_AsGeoJSON(y.location, 6) AS geometry, y.colonies FROM yards y WHERE y.apiary_id = :apiaryId ORDER BY y.name',
    { replacements: { apiaryId } },
  );
}

const openAlertsSql = (column: string) => `
  SELECT al.id, al.grade, al.state, s.product_name AS product, o.name AS farm_name, al.raised_at,
    (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
  FROM alerts al JOIN spray_plans s ON s.id = al.spray_plan_id JOIN organizations o ON o.id = al.farm_id
  WHERE al.${column} = $orgId::uuid AND al.state <> 'resolved'
  ORDER BY al.raised_at DESC LIMIT 20`;

const upcomingSpraysSql = `
  SELECT s.id, s.product_name AS product, lower(s.planned_window) AS start, upper(s.planned_window) AS "end", s.rt25_hours,
    upper(s.exposure_window) AS residual_end, s.state,
    (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
  FROM spray_plans s
  WHERE s.farm_id = $farmId::uuid AND s.state = 'planned' AND upper(s.exposure_window) >= $now::timestamptz
  ORDER BY lower(s.planned_window) LIMIT 10`;

/** The latest trap count per block and pest model of the farm. */
const latestTrapCountsSql = `
  SELECT DISTINCT ON (t.block_id, t.pest_model_id) b.name AS block_name, m.name AS pest, t.checked_on::text AS checked_on, t.moths
  FROM pest_trap_counts t JOIN blocks b ON b.id = t.block_id JOIN pest_models m ON m.id = t.pest_model_id
  WHERE b.farm_id = $farmId::uuid
  ORDER BY t.block_id, t.pest_model_id, t.checked_on DESC`;

/** Issued invoices not yet settled: total less succeeded payments and credit notes, plus succeeded refunds. */
const moneyOpenSql = (column: string) => `
  SELECT currency, sum(open_cents)::int AS cents, count(*)::int AS count FROM (
    SELECT i.currency, i.total_cents
      - coalesce((SELECT sum(p.amount_cents) FROM payments p WHERE p.invoice_id = i.id AND p.state = 'succeeded'), 0)
      - coalesce((SELECT sum(c.amount_cents) FROM credit_notes c WHERE c.invoice_id = i.id), 0)
      + coalesce((SELECT sum(r.amount_cents) FROM refunds r WHERE r.invoice_id = i.id AND r.state = 'succeeded'), 0) AS open_cents
    FROM invoices i WHERE i.${column} = $orgId::uuid AND i.lifecycle = 'issued'
  ) x WHERE open_cents > 0 GROUP BY currency ORDER BY currency`;

export type OpenAlertRow = { id: string; grade: string; state: string; product: string; blocks: string | null; farm_name: string; raised_at: Date | string };
export type MoneyOpenRow = { currency: string; cents: number; count: number };
export type UpcomingSprayRow = { id: string; product: string; start: string; end: string; rt25_hours: number | null; residual_end: string; state: string; blocks: string | null };
export type TrapCountRow = { block_name: string; pest: string; checked_on: string; moths: number };
export type GrowerBlockRow = {
  id: string; name: string; crop: string; acres: number; colonies_per_acre: number;
  bloom_start: string | null; full_bloom: string | null; petal_fall: string | null; planned: number; on_site: number;
};

// The beekeeper's overview reads the same parts by the apiary's column (the grower's come
// with its one statement below).
const apiaryOpenAlertsStatement = prepareStatement('overview-open-alerts-apiary', openAlertsSql(sideColumn('apiary')));
const apiaryMoneyDueStatement = prepareStatement('overview-money-due-apiary', moneyOpenSql(sideColumn('apiary')));

export function selectApiaryOpenAlerts(sequelize: Sequelize, apiaryId: string) {
  return queryPrepared<OpenAlertRow>(sequelize, apiaryOpenAlertsStatement, { orgId: apiaryId });
}

export function selectApiaryMoneyDue(sequelize: Sequelize, apiaryId: string) {
  return queryPrepared<MoneyOpenRow>(sequelize, apiaryMoneyDueStatement, { orgId: apiaryId });
}

// The grower's overview is asked for on every visit: its six parts in one round trip, each
// as JSON (times as ISO text), in the order each part sorts by.
const growerOverviewStatement = prepareStatement('overview-grower', `
  SELECT
    (SELECT coalesce(json_agg(part ORDER BY part.name), '[]') FROM (${growerBlocksSql}) part) AS blocks,
    (SELECT row_to_json(part) FROM (${growerColonySumsSql}) part) AS sums,
    (SELECT coalesce(json_agg(part ORDER BY part.raised_at DESC), '[]') FROM (${openAlertsSql(sideColumn('farm'))}) part) AS open_alerts,
    (SELECT coalesce(json_agg(part ORDER BY part.start), '[]') FROM (${upcomingSpraysSql}) part) AS upcoming_sprays,
    (SELECT coalesce(json_agg(part), '[]') FROM (${latestTrapCountsSql}) part) AS trap_counts,
    (SELECT coalesce(json_agg(part ORDER BY part.currency), '[]') FROM (${moneyOpenSql(sideColumn('farm'))}) part) AS money`);

export interface GrowerOverviewParts {
  blocks: GrowerBlockRow[];
  sums: { requested: number; committed: number };
  open_alerts: OpenAlertRow[];
  upcoming_sprays: UpcomingSprayRow[];
  trap_counts: TrapCountRow[];
  money: MoneyOpenRow[];
}

/** The grower's overview for the season window: blocks with colonies planned and on site, colony sums, open alerts, upcoming sprays, trap counts, money owed. */
export async function selectGrowerOverview(sequelize: Sequelize, p: SeasonWindow & { farmId: string; season: number }): Promise<GrowerOverviewParts> {
  const [row] = await queryPrepared<GrowerOverviewParts>(sequelize, growerOverviewStatement, { ...p, orgId: p.farmId, squareMetresPerAcre: SQUARE_METRES_PER_ACRE });
  return row!;
}

export function selectTimelineSprays(sequelize: Sequelize, p: { ids: string[]; from: string; to: string }) {
  return queryRows<{ block_id: string; id: string; product: string; state: string; start: Date; end: Date; residual_end: Date; applied_at: Date | null }>(
    sequelize,
    `SELECT sb.block_id, s.id, s.product_name AS product, s.state, lower(s.planned_window) AS start, upper(s.planned_window) AS "end",
       upper(s.exposure_window) AS residual_end, s.applied_at
     FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
     WHERE sb.block_id IN (:ids) AND s.state <> 'cancelled' AND s.exposure_window && tstzrange(:from, :to, '[)')`,
    { replacements: { ...p, ids: idsOrNone(p.ids) } },
  );
}

export function selectTimelineAlerts(sequelize: Sequelize, side: Side, p: { ids: string[]; orgId: string; from: string; to: string }) {
  return queryRows<{ block_id: string; id: string; grade: string; state: string; product: string; raised_at: Date }>(
    sequelize,
    `SELECT sb.block_id, al.id, al.grade, al.state, s.product_name AS product, al.raised_at
     FROM alerts al JOIN spray_plans s ON s.id = al.spray_plan_id JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
     WHERE sb.block_id IN (:ids) AND al.${sideColumn(side)} = :orgId AND al.raised_at >= :from AND al.raised_at < :to`,
    { replacements: { ...p, ids: idsOrNone(p.ids) } },
  );
}

/** The buffer around the sprayed blocks (the farm's spray buffer distance) of sprays under way or due before `until`. */
export function selectSprayBuffers(sequelize: Sequelize, p: { ids: string[]; now: string; until: string }) {
  return queryRows<{ id: string; product: string; geometry: string | null; active: boolean; start: Date; buffer_m: number; time_zone: string }>(
    sequelize,
    `SELECT s.id, s.product_name AS product, s.exposure_window @> :now::timestamptz AS active, lower(s.planned_window) AS start, o.spray_buffer_m AS buffer_m, o.time_zone,
       ST_AsGeoJSON(ST_Union(ST_Buffer(coalesce(b.outline, b.location)::geography, o.spray_buffer_m)::geometry), 6) AS geometry
     FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id JOIN blocks b ON b.id = sb.block_id
     JOIN organizations o ON o.id = s.farm_id
     WHERE sb.block_id IN (:ids) AND s.state <> 'cancelled'
       AND s.exposure_window && tstzrange(:now::timestamptz, :until::timestamptz, '[)')
       AND coalesce(b.outline, b.location) IS NOT NULL
     GROUP BY s.id, o.spray_buffer_m, o.time_zone`,
    { replacements: { ...p, ids: idsOrNone(p.ids) } },
  );
}

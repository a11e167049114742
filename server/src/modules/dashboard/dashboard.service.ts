// Read-only overviews of a season, each scoped to the signed-in user's organization:
// the grower's blocks and colonies, the beekeeper's colonies committed by week and the
// moves due, the season timeline and the season map. Sums are done in SQL.
import { QueryTypes } from 'sequelize';
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { Organization } from '../../db/models/organization.model.js';
import { notFound } from '../../errors/http-errors.js';
import { seasonClock, type SeasonClock } from './season-clock.js';
import { coloniesNeeded } from '../../../../shared/domain/stocking.js';
import { createSeasonExtras } from './season-extras.js';
import type {
  BeekeeperDashboard,
  ColonyWeek,
  GrowerBlockSummary,
  GrowerDashboard,
  PlacementDue,
  SeasonMap,
  SeasonMapFeature,
  SeasonTimeline,
  TimelineItem,
  TimelineRow,
} from '../../../../shared/schemas/dashboard.js';

const SQUARE_METRES_PER_ACRE = 4046.8564224;

export function createDashboardService(ctx: AppContext) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    ctx.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const extras = createSeasonExtras(ctx);

  async function organizationOf(user: AuthUser) {
    const org = user.organizationId ? await Organization.findByPk(user.organizationId) : null;
    if (!org) throw notFound('Your organization');
    return org;
  }

  function window(clock: SeasonClock) {
    return { from: clock.seasonFrom.toISOString(), to: clock.seasonTo.toISOString(), now: clock.now.toISOString() };
  }

  function bloomState(today: string, bloom: GrowerBlockSummary['bloomWindow']): GrowerBlockSummary['bloomState'] {
    if (!bloom) return 'no-forecast';
    if (today < bloom.bloomStart) return 'before-bloom';
    if (today > bloom.petalFall) return 'after-bloom';
    return 'in-bloom';
  }

  return {
    async grower(user: AuthUser, season?: number): Promise<GrowerDashboard> {
      const org = await organizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), farmId: org.id, season: clock.season };
      const blockRows = await select<{
        id: string; name: string; crop: string; acres: number; colonies_per_acre: number;
        bloom_start: string | null; full_bloom: string | null; petal_fall: string | null; planned: number; on_site: number;
      }>(
        `SELECT b.id, b.name, b.crop, b.area_m2 / ${SQUARE_METRES_PER_ACRE} AS acres, b.colonies_per_acre,
           bw.bloom_start::text AS bloom_start, bw.full_bloom::text AS full_bloom, bw.petal_fall::text AS petal_fall,
           coalesce(p.planned, 0)::int AS planned, coalesce(p.on_site, 0)::int AS on_site
         FROM blocks b
         LEFT JOIN current_bloom_windows bw ON bw.block_id = b.id AND bw.season = :season
         LEFT JOIN LATERAL (
           SELECT sum(pl.colonies_planned) AS planned,
                  sum(coalesce(pl.colonies_delivered, 0)) FILTER (WHERE pl.state = 'delivered' AND pl.on_site @> :now::timestamptz) AS on_site
           FROM drop_sites d
           JOIN placements pl ON pl.drop_site_id = d.id
           JOIN agreements a ON a.id = pl.agreement_id AND a.state <> 'cancelled'
           WHERE d.block_id = b.id AND pl.on_site && tstzrange(:from, :to, '[)')
         ) p ON true
         WHERE b.farm_id = :farmId
         ORDER BY b.name`,
        w,
      );
      const blocks: GrowerBlockSummary[] = blockRows.map((r) => {
        const bloomWindow = r.bloom_start ? { bloomStart: r.bloom_start, fullBloom: r.full_bloom, petalFall: r.petal_fall! } : null;
        return {
          id: r.id, name: r.name, crop: r.crop, acres: Number(r.acres), coloniesPerAcre: Number(r.colonies_per_acre),
          // The one rule the block page uses too (shared/domain/stocking.ts).
          coloniesNeeded: coloniesNeeded(Number(r.acres), Number(r.colonies_per_acre)), coloniesPlanned: r.planned, coloniesOnSite: r.on_site,
          bloomWindow, bloomState: bloomState(clock.today, bloomWindow),
        };
      });
      const [sums] = await select<{ requested: number; committed: number }>(
        `SELECT
           (SELECT coalesce(sum(hrb.colonies), 0)::int FROM hive_requests r JOIN hive_request_blocks hrb ON hrb.request_id = r.id
             WHERE r.farm_id = :farmId AND r.state IN ('listed', 'filled', 'closed')
               AND (r.expected_on_site IS NULL OR r.expected_on_site && tstzrange(:from, :to, '[)'))) AS requested,
           (SELECT coalesce(sum(coalesce(a.colonies, c.colonies)), 0)::int FROM commitments c
             JOIN hive_requests r ON r.id = c.request_id
             LEFT JOIN agreements a ON a.commitment_id = c.id
             WHERE r.farm_id = :farmId AND c.state = 'accepted' AND (a.id IS NULL OR a.state <> 'cancelled')
               AND coalesce(a.expected_on_site, r.expected_on_site, tstzrange(:from, :to, '[)')) && tstzrange(:from, :to, '[)')) AS committed`,
        w,
      );
      const [openAlerts, upcomingSprays, pestTraps, moneyOwed] = await Promise.all([
        extras.openAlerts(org.id, 'farm'),
        extras.upcomingSprays(org.id, clock),
        extras.pestTraps(org.id),
        extras.money(org.id, 'farm'),
      ]);
      return {
        season: clock.season,
        today: clock.today,
        timeZone: clock.timeZone,
        blocks,
        totals: {
          coloniesNeeded: blocks.reduce((s, b) => s + b.coloniesNeeded, 0),
          coloniesRequested: sums.requested,
          coloniesCommitted: sums.committed,
          coloniesOnSite: blocks.reduce((s, b) => s + b.coloniesOnSite, 0),
        },
        openAlerts,
        upcomingSprays,
        pestTraps,
        moneyOwed,
      };
    },

    async beekeeper(user: AuthUser, days: number, season?: number): Promise<BeekeeperDashboard> {
      const org = await organizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), apiaryId: org.id, tz: org.timeZone };
      // Accepted commitments count from the request's window until the agreement sets its own.
      const committedSql = `
        SELECT coalesce(a.colonies, c.colonies) AS colonies, r.farm_id, coalesce(a.expected_on_site, r.expected_on_site) AS on_site
        FROM commitments c
        JOIN hive_requests r ON r.id = c.request_id
        LEFT JOIN agreements a ON a.commitment_id = c.id
        WHERE c.apiary_id = :apiaryId AND c.state = 'accepted' AND (a.id IS NULL OR a.state <> 'cancelled')
          AND coalesce(a.expected_on_site, r.expected_on_site) && tstzrange(:from, :to, '[)')`;
      const [span] = await select<{ first: string | null; last: string | null }>(
        `SELECT min(greatest(lower(on_site), :from::timestamptz)) AS first, max(least(upper(on_site), :to::timestamptz)) AS last FROM (${committedSql}) x`,
        w,
      );
      const zone = org.timeZone;
      const today = DateTime.fromJSDate(clock.now, { zone }).startOf('week');
      const first = span.first ? DateTime.fromJSDate(new Date(span.first), { zone }).startOf('week') : today;
      const last = span.last ? DateTime.fromJSDate(new Date(new Date(span.last).getTime() - 1), { zone }).startOf('week') : today.plus({ weeks: 7 });
      const weekStarts: string[] = [];
      for (let d = first; d <= last && weekStarts.length < 60; d = d.plus({ weeks: 1 })) weekStarts.push(d.toISODate()!);
      const weekRows = await select<{ week_start: string; farm_id: string; farm_name: string; colonies: number }>(
        `SELECT wk.week_start::text AS week_start, x.farm_id, o.name AS farm_name, sum(x.colonies)::int AS colonies
         FROM unnest(ARRAY[:weeks]::date[]) AS wk(week_start)
         JOIN (${committedSql}) x
           ON x.on_site && tstzrange(wk.week_start::timestamp AT TIME ZONE :tz, (wk.week_start + 7)::timestamp AT TIME ZONE :tz, '[)')
         JOIN organizations o ON o.id = x.farm_id
         GROUP BY wk.week_start, x.farm_id, o.name
         ORDER BY wk.week_start, o.name`,
        { ...w, weeks: weekStarts.length ? weekStarts : ['1970-01-05'] },
      );
      const weeks: ColonyWeek[] = weekStarts.map((weekStart) => {
        const byFarm = weekRows.filter((r) => r.week_start === weekStart).map((r) => ({ farmId: r.farm_id, farmName: r.farm_name, colonies: r.colonies }));
        return { weekStart, committed: byFarm.reduce((s, f) => s + f.colonies, 0), byFarm };
      });

      const horizon = new Date(clock.now.getTime() + days * 86_400_000).toISOString();
      const dueRows = await select<{
        placement_id: string; agreement_id: string; farm_name: string; drop_site_name: string; block_name: string; colonies: number; due_at: Date; kind: 'drop-off' | 'pickup';
      }>(
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
        { ...w, horizon },
      );
      const toDue = (r: (typeof dueRows)[number]): PlacementDue => ({
        placementId: r.placement_id, agreementId: r.agreement_id, farmName: r.farm_name, dropSiteName: r.drop_site_name, blockName: r.block_name,
        colonies: r.colonies, dueAt: new Date(r.due_at).toISOString(), overdue: new Date(r.due_at) < clock.now,
      });
      const [openAlerts, moneyDue] = await Promise.all([extras.openAlerts(org.id, 'apiary'), extras.money(org.id, 'apiary')]);
      return {
        season: clock.season,
        today: clock.today,
        timeZone: zone,
        coloniesOwned: org.coloniesOwned,
        canEditColoniesOwned: user.roleKey === 'apiary:owner',
        weeks,
        peakCommitted: Math.max(0, ...weeks.map((wk) => wk.committed)),
        dropOffsDue: dueRows.filter((r) => r.kind === 'drop-off').map(toDue),
        pickupsDue: dueRows.filter((r) => r.kind === 'pickup').map(toDue),
        days,
        openAlerts,
        moneyDue,
      };
    },

    async setColoniesOwned(user: AuthUser, coloniesOwned: number | null) {
      const org = await organizationOf(user);
      await org.update({ coloniesOwned });
      return { coloniesOwned: org.coloniesOwned };
    },

    async timeline(user: AuthUser, season?: number): Promise<SeasonTimeline> {
      const org = await organizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), orgId: org.id, season: clock.season, tz: org.timeZone };
      const blocks = await select<{ id: string; name: string; crop: string; farm_name: string }>(
        `SELECT b.id, b.name, b.crop, o.name AS farm_name FROM blocks b JOIN organizations o ON o.id = b.farm_id
         WHERE ${visibleBlocks(org.kind)} ORDER BY o.name, b.name`,
        w,
      );
      const ids = blocks.map((b) => b.id);
      const none = ['00000000-0000-0000-0000-000000000000'];
      const bloom = await select<{ block_id: string; id: string; start: Date; end: Date; full_bloom: string | null }>(
        `SELECT bw.block_id, bw.id, bw.bloom_start::timestamp AT TIME ZONE :tz AS start,
           (bw.petal_fall + 1)::timestamp AT TIME ZONE :tz AS "end", bw.full_bloom::text AS full_bloom
         FROM current_bloom_windows bw WHERE bw.season = :season AND bw.block_id IN (:ids)`,
        { ...w, ids: ids.length ? ids : none },
      );
      const placements = await select<{ block_id: string; id: string; agreement_id: string; start: Date | null; end: Date | null; state: string; colonies: number; site: string }>(
        `SELECT d.block_id, p.id, p.agreement_id, lower(p.on_site) AS start,
           CASE WHEN upper_inf(p.on_site) THEN upper(a.expected_on_site) ELSE upper(p.on_site) END AS "end",
           p.state, coalesce(p.colonies_delivered, p.colonies_planned) AS colonies, d.name AS site
         FROM placements p JOIN drop_sites d ON d.id = p.drop_site_id JOIN agreements a ON a.id = p.agreement_id AND a.state <> 'cancelled'
         WHERE d.block_id IN (:ids) AND p.on_site && tstzrange(:from, :to, '[)')
           ${org.kind === 'apiary' ? 'AND a.apiary_id = :orgId' : ''}`,
        { ...w, ids: ids.length ? ids : none },
      );
      const [sprays, alerts] = await Promise.all([extras.timelineSprays(ids, clock), extras.timelineAlerts(ids, org.id, org.kind, clock)]);
      const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
      const rows: TimelineRow[] = blocks.map((b) => {
        const items: TimelineItem[] = [
          ...bloom.filter((x) => x.block_id === b.id).map((x): TimelineItem => ({
            kind: 'bloom', id: x.id, label: x.full_bloom ? `Bloom (full bloom ${x.full_bloom})` : 'Bloom', start: iso(x.start)!, end: iso(x.end), openId: b.id,
          })),
          ...placements.filter((x) => x.block_id === b.id && x.start).map((x): TimelineItem => ({
            kind: 'placement', id: x.id, label: `${x.colonies} colonies at ${x.site}`, start: iso(x.start)!, end: iso(x.end), state: x.state, openId: x.agreement_id,
          })),
          ...sprays.filter((x) => x.blockId === b.id).map((x) => x.item),
          ...alerts.filter((x) => x.blockId === b.id).map((x) => x.item),
        ];
        return { blockId: b.id, blockName: b.name, farmName: b.farm_name, crop: b.crop, items };
      });
      return { season: clock.season, timeZone: org.timeZone, range: { from: w.from, to: w.to }, rows };
    },

    async map(user: AuthUser, season?: number): Promise<SeasonMap> {
      const org = await organizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), orgId: org.id, season: clock.season, today: clock.today };
      const blocks = await select<{ id: string; name: string; crop: string; geometry: string; bloom_start: string | null; petal_fall: string | null; farm_name: string }>(
        `SELECT b.id, b.name, b.crop, ST_AsGeoJSON(coalesce(b.outline, b.location), 6) AS geometry, o.name AS farm_name,
           bw.bloom_start::text AS bloom_start, bw.petal_fall::text AS petal_fall
         FROM blocks b JOIN organizations o ON o.id = b.farm_id
         LEFT JOIN current_bloom_windows bw ON bw.block_id = b.id AND bw.season = :season
         WHERE ${visibleBlocks(org.kind)} AND coalesce(b.outline, b.location) IS NOT NULL ORDER BY b.name`,
        w,
      );
      const sites = await select<{ id: string; name: string; geometry: string; block_name: string; planned: number; on_site: number; scheduled: number }>(
        `SELECT d.id, d.name, ST_AsGeoJSON(d.location, 6) AS geometry, b.name AS block_name, d.colonies_planned AS planned,
           coalesce(sum(coalesce(p.colonies_delivered, 0)) FILTER (WHERE p.state = 'delivered'), 0)::int AS on_site,
           count(p.id) FILTER (WHERE p.state = 'scheduled')::int AS scheduled
         FROM drop_sites d JOIN blocks b ON b.id = d.block_id JOIN hive_requests r ON r.id = d.request_id
         LEFT JOIN placements p ON p.drop_site_id = d.id
           AND p.agreement_id IN (SELECT a.id FROM agreements a WHERE a.state <> 'cancelled' ${org.kind === 'apiary' ? 'AND a.apiary_id = :orgId' : ''})
           AND p.on_site && tstzrange(:from, :to, '[)')
         WHERE ${org.kind === 'farm' ? 'r.farm_id = :orgId' : `EXISTS (SELECT 1 FROM commitments c WHERE c.request_id = r.id AND c.apiary_id = :orgId AND c.state = 'accepted')`}
           AND r.state <> 'withdrawn'
         GROUP BY d.id, b.name ORDER BY d.name`,
        w,
      );
      const yards =
        org.kind === 'apiary'
          ? await select<{ id: string; name: string; geometry: string; colonies: number | null }>(
              `SELECT y.id, y.name, ST_AsGeoJSON(y.location, 6) AS geometry, y.colonies FROM yards y WHERE y.apiary_id = :orgId ORDER BY y.name`,
              w,
            )
          : [];
      const buffers = await extras.sprayBuffers(blocks.map((b) => b.id), clock);
      const feature = (id: string, geometry: string, properties: SeasonMapFeature['properties']): SeasonMapFeature => ({
        type: 'Feature', id, geometry: JSON.parse(geometry) as SeasonMapFeature['geometry'], properties,
      });
      const features: SeasonMapFeature[] = [
        ...blocks.map((b) => {
          const state = bloomState(clock.today, b.bloom_start ? { bloomStart: b.bloom_start, fullBloom: null, petalFall: b.petal_fall! } : null);
          return feature(b.id, b.geometry, { kind: 'block', name: b.name, state, detail: `${b.crop} · ${b.farm_name}` });
        }),
        ...buffers,
        ...sites.map((s) =>
          feature(s.id, s.geometry, {
            kind: 'drop-site', name: s.name, state: s.on_site > 0 ? 'colonies-on-site' : s.scheduled > 0 ? 'scheduled' : 'no-colonies',
            detail: `${s.block_name} · ${s.on_site} of ${s.planned} colonies on site`,
          }),
        ),
        ...yards.map((y) => feature(y.id, y.geometry, { kind: 'yard', name: y.name, state: 'yard', detail: y.colonies == null ? 'Colonies not entered' : `${y.colonies} colonies` })),
      ];
      return { season: clock.season, type: 'FeatureCollection', features };
    },
  };
}

/** Blocks a farm owns; for a beekeeper, blocks of requests the business has an accepted commitment on. */
function visibleBlocks(kind: 'farm' | 'apiary') {
  return kind === 'farm'
    ? 'b.farm_id = :orgId'
    : `b.id IN (SELECT hrb.block_id FROM hive_request_blocks hrb JOIN commitments c ON c.request_id = hrb.request_id
         WHERE c.apiary_id = :orgId AND c.state = 'accepted'
         UNION SELECT d.block_id FROM drop_sites d JOIN placements p ON p.drop_site_id = d.id JOIN agreements a ON a.id = p.agreement_id WHERE a.apiary_id = :orgId)`;
}

export type DashboardService = ReturnType<typeof createDashboardService>;

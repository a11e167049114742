// Read-only overviews of a season, each scoped to the signed-in user's organization:
// the grower's blocks and colonies, the beekeeper's colonies committed by week and the
// moves due, the season timeline and the season map. Sums are done in SQL (dashboard.queries.ts).
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { notFound } from '../../errors/http-errors.js';
import { isAllowed } from '../../../../shared/policies/policy-table.js';
import { dashboardPolicy } from './dashboard.policy.js';
import { seasonClock, type SeasonClock } from './season-clock.js';
import { coloniesNeeded } from '../../../../shared/domain/stocking.js';
import { createSeasonExtras, openAlertsOf, pestTrapsOf, upcomingSpraysOf } from './season-extras.js';
import { cropSet } from '../../../../shared/labels/crops.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import {
  selectGrowerOverview, selectCommittedSpan, selectCommittedWeeks, selectMovesDue, selectTimelineBlocks, selectTimelineBloom,
  selectTimelinePlacements, selectMapBlocks, selectMapDropSites, selectMapYards,
} from './dashboard.queries.js';
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

export function createDashboardService(ctx: AppContext) {
  const db = ctx.sequelize;
  const extras = createSeasonExtras(ctx);

  /** The signed-in user's organization as the session already knows it (no query). */
  function sessionOrganizationOf(user: AuthUser) {
    if (!user.organizationId || !user.organizationTimeZone || !user.organizationKind) throw notFound('Your organization');
    return { id: user.organizationId, timeZone: user.organizationTimeZone, kind: user.organizationKind };
  }

  async function organizationOf(user: AuthUser) {
    const org = user.organizationId ? await ctx.models.Organization.findByPk(user.organizationId) : null;
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
      const org = sessionOrganizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), farmId: org.id, season: clock.season };
      const parts = await selectGrowerOverview(db, w);
      const { sums } = parts;
      const blocks: GrowerBlockSummary[] = parts.blocks.map((r) => {
        const bloomWindow = r.bloom_start ? { bloomStart: r.bloom_start, fullBloom: r.full_bloom, petalFall: r.petal_fall! } : null;
        return {
          id: r.id, name: r.name, crop: r.crop, acres: r.acres, coloniesPerAcre: r.colonies_per_acre,
          // The one rule the block page uses too (shared/domain/stocking.ts).
          coloniesNeeded: coloniesNeeded(r.acres, r.colonies_per_acre), coloniesPlanned: r.planned, coloniesOnSite: r.on_site,
          bloomWindow, bloomState: bloomState(clock.today, bloomWindow),
        };
      });
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
        openAlerts: openAlertsOf(parts.open_alerts, 'farm'),
        upcomingSprays: upcomingSpraysOf(parts.upcoming_sprays),
        pestTraps: pestTrapsOf(parts.trap_counts),
        moneyOwed: parts.money,
      };
    },

    async beekeeper(user: AuthUser, days: number, season?: number): Promise<BeekeeperDashboard> {
      const org = await organizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), apiaryId: org.id, tz: org.timeZone };
      const span = await selectCommittedSpan(db, w);
      const zone = org.timeZone;
      const today = DateTime.fromJSDate(clock.now, { zone }).startOf('week');
      const first = span.first ? DateTime.fromJSDate(new Date(span.first), { zone }).startOf('week') : today;
      const last = span.last ? DateTime.fromJSDate(new Date(new Date(span.last).getTime() - 1), { zone }).startOf('week') : today.plus({ weeks: 7 });
      const weekStarts: string[] = [];
      for (let d = first; d <= last && weekStarts.length < 60; d = d.plus({ weeks: 1 })) weekStarts.push(d.toISODate()!);
      const weekRows = await selectCommittedWeeks(db, { ...w, weeks: weekStarts });
      const weeks: ColonyWeek[] = weekStarts.map((weekStart) => {
        const byFarm = weekRows.filter((r) => r.week_start === weekStart).map((r) => ({ farmId: r.farm_id, farmName: r.farm_name, colonies: r.colonies }));
        return { weekStart, committed: byFarm.reduce((s, f) => s + f.colonies, 0), byFarm };
      });

      const horizon = new Date(clock.now.getTime() + days * 86_400_000).toISOString();
      const dueRows = await selectMovesDue(db, { apiaryId: org.id, horizon });
      const toDue = (r: (typeof dueRows)[number]): PlacementDue => ({
        placementId: r.placement_id, agreementId: r.agreement_id, farmName: r.farm_name, dropSiteName: r.drop_site_name, blockName: r.block_name,
        colonies: r.colonies, dueAt: new Date(r.due_at).toISOString(), overdue: new Date(r.due_at) < clock.now,
      });
      const [openAlerts, moneyDue] = await Promise.all([extras.apiaryOpenAlerts(org.id), extras.moneyDue(org.id)]);
      return {
        season: clock.season,
        today: clock.today,
        timeZone: zone,
        coloniesOwned: org.coloniesOwned,
        canEditColoniesOwned: isAllowed(dashboardPolicy, 'setColoniesOwned', user.roleKey),
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
      const org = sessionOrganizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const w = { ...window(clock), orgId: org.id, season: clock.season, tz: org.timeZone };
      const blocks = await selectTimelineBlocks(db, org.kind, org.id);
      const ids = blocks.map((b) => b.id);
      const [bloom, placements, sprays, alerts] = await Promise.all([
        selectTimelineBloom(db, { season: clock.season, tz: org.timeZone, ids }),
        selectTimelinePlacements(db, org.kind, { ...window(clock), orgId: org.id, ids }),
        extras.timelineSprays(ids, clock),
        extras.timelineAlerts(ids, org.id, org.kind, clock),
      ]);
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
      const org = sessionOrganizationOf(user);
      const clock = seasonClock(ctx.now(), org.timeZone, season);
      const [blocks, sites, yards] = await Promise.all([
        selectMapBlocks(db, org.kind, { orgId: org.id, season: clock.season }),
        selectMapDropSites(db, org.kind, { ...window(clock), orgId: org.id }),
        org.kind === 'apiary' ? selectMapYards(db, org.id) : Promise.resolve([]),
      ]);
      const buffers = await extras.sprayBuffers(blocks.map((b) => b.id), clock);
      const feature = (id: string, geometry: string, properties: SeasonMapFeature['properties']): SeasonMapFeature => ({
        type: 'Feature', id, geometry: JSON.parse(geometry) as SeasonMapFeature['geometry'], properties,
      });
      const features: SeasonMapFeature[] = [
        ...blocks.map((b) => {
          const state = bloomState(clock.today, b.bloom_start ? { bloomStart: b.bloom_start, fullBloom: null, petalFall: b.petal_fall! } : null);
          return feature(b.id, b.geometry, { kind: 'block', name: b.name, state, detail: `${labelOf(cropSet, b.crop)} · ${b.farm_name}` });
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

export type DashboardService = ReturnType<typeof createDashboardService>;

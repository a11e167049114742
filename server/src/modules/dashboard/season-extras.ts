// The overview's parts that come from the spray, alert and invoice features: open alerts,
// upcoming sprays and pest trap checks, money owed or due, spray windows with their
// residual tail, and spray buffers. Each answers null (or nothing) while its feature's
// tables are absent from the database, so the overview works on every installation.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { DashboardAlert, DashboardSpray, MoneyLine, PestTrapCheck, SeasonMapFeature, TimelineItem } from '../../../../shared/schemas/dashboard.js';
import type { SeasonClock } from './season-clock.js';
import { existingTables } from './optional-tables.js';

type Side = 'farm' | 'apiary';
const NO_IDS = ['00000000-0000-0000-0000-000000000000'];
/** How far ahead the map draws spray buffers. */
const BUFFER_LOOKAHEAD_DAYS = 14;

export function createSeasonExtras(ctx: AppContext) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    ctx.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const has = async (...names: string[]) => {
    const found = await existingTables(ctx.sequelize, names);
    return names.every((n) => found.has(n));
  };
  const sideColumn = (side: Side) => (side === 'farm' ? 'farm_id' : 'apiary_id');
  const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

  return {
    async openAlerts(orgId: string, side: Side): Promise<DashboardAlert[] | null> {
      if (!(await has('alerts', 'spray_plans', 'spray_plan_blocks'))) return null;
      const rows = await select<{ id: string; grade: string; state: string; product: string; blocks: string | null; farm_name: string; raised_at: Date }>(
        `SELECT al.id, al.grade, al.state, s.product_name AS product, o.name AS farm_name, al.raised_at,
           (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
         FROM alerts al JOIN spray_plans s ON s.id = al.spray_plan_id JOIN organizations o ON o.id = al.farm_id
         WHERE al.${sideColumn(side)} = :orgId AND al.state <> 'resolved'
         ORDER BY al.raised_at DESC LIMIT 20`,
        { orgId },
      );
      return rows.map((r) => ({
        id: r.id, severity: r.grade, state: r.state,
        title: side === 'farm' ? `${r.product} on ${r.blocks ?? 'a block'}` : `${r.product} at ${r.farm_name} (${r.blocks ?? 'a block'})`,
        raisedAt: iso(r.raised_at)!,
      }));
    },

    async upcomingSprays(farmId: string, clock: SeasonClock): Promise<DashboardSpray[] | null> {
      if (!(await has('spray_plans', 'spray_plan_blocks'))) return null;
      const rows = await select<{ id: string; product: string; start: Date; end: Date; rt25_hours: number | null; residual_end: Date; state: string; blocks: string | null }>(
        `SELECT s.id, s.product_name AS product, lower(s.planned_window) AS start, upper(s.planned_window) AS "end", s.rt25_hours,
           upper(s.exposure_window) AS residual_end, s.state,
           (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
         FROM spray_plans s
         WHERE s.farm_id = :farmId AND s.state = 'planned' AND upper(s.exposure_window) >= :now::timestamptz
         ORDER BY lower(s.planned_window) LIMIT 10`,
        { farmId, now: clock.now.toISOString() },
      );
      return rows.map((r) => ({
        id: r.id, product: r.product, blockNames: r.blocks, plannedStart: iso(r.start)!, plannedEnd: iso(r.end)!,
        residualHours: r.rt25_hours === null ? null : Number(r.rt25_hours), residualEnd: iso(r.residual_end)!, state: r.state,
      }));
    },

    async pestTraps(farmId: string): Promise<PestTrapCheck[] | null> {
      if (!(await has('pest_trap_counts', 'pest_models'))) return null;
      const rows = await select<{ block_name: string; pest: string; checked_on: string; moths: number }>(
        `SELECT DISTINCT ON (t.block_id, t.pest_model_id) b.name AS block_name, m.name AS pest, t.checked_on::text AS checked_on, t.moths
         FROM pest_trap_counts t JOIN blocks b ON b.id = t.block_id JOIN pest_models m ON m.id = t.pest_model_id
         WHERE b.farm_id = :farmId
         ORDER BY t.block_id, t.pest_model_id, t.checked_on DESC`,
        { farmId },
      );
      return rows.map((r) => ({ blockName: r.block_name, pest: r.pest, checkedOn: r.checked_on, moths: r.moths }));
    },

    /** Issued invoices not yet settled: total less succeeded payments and credit notes, plus succeeded refunds. */
    async money(orgId: string, side: Side): Promise<MoneyLine[] | null> {
      if (!(await has('invoices', 'payments', 'credit_notes', 'refunds'))) return null;
      const rows = await select<{ currency: string; cents: number; count: number }>(
        `SELECT currency, sum(open_cents)::int AS cents, count(*)::int AS count FROM (
           SELECT i.currency, i.total_cents
             - coalesce((SELECT sum(p.amount_cents) FROM payments p WHERE p.invoice_id = i.id AND p.state = 'succeeded'), 0)
             - coalesce((SELECT sum(c.amount_cents) FROM credit_notes c WHERE c.invoice_id = i.id), 0)
             + coalesce((SELECT sum(r.amount_cents) FROM refunds r WHERE r.invoice_id = i.id AND r.state = 'succeeded'), 0) AS open_cents
           FROM invoices i WHERE i.${sideColumn(side)} = :orgId AND i.lifecycle = 'issued'
         ) x WHERE open_cents > 0 GROUP BY currency ORDER BY currency`,
        { orgId },
      );
      return rows;
    },

    async timelineSprays(blockIds: string[], clock: SeasonClock): Promise<Array<{ blockId: string; item: TimelineItem }>> {
      if (!(await has('spray_plans', 'spray_plan_blocks'))) return [];
      const rows = await select<{ block_id: string; id: string; product: string; state: string; start: Date; end: Date; residual_end: Date; applied_at: Date | null }>(
        `SELECT sb.block_id, s.id, s.product_name AS product, s.state, lower(s.planned_window) AS start, upper(s.planned_window) AS "end",
           upper(s.exposure_window) AS residual_end, s.applied_at
         FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
         WHERE sb.block_id IN (:ids) AND s.state <> 'cancelled' AND s.exposure_window && tstzrange(:from, :to, '[)')`,
        { ids: blockIds.length ? blockIds : NO_IDS, from: clock.seasonFrom.toISOString(), to: clock.seasonTo.toISOString() },
      );
      return rows.map((r) => ({
        blockId: r.block_id,
        item: {
          kind: 'spray', id: r.id, label: r.state === 'applied' ? `${r.product} (applied)` : r.product, state: r.state,
          start: iso(r.applied_at ?? r.start)!, end: iso(r.end), residualEnd: iso(r.residual_end), openId: r.id,
        },
      }));
    },

    async timelineAlerts(blockIds: string[], orgId: string, side: Side, clock: SeasonClock): Promise<Array<{ blockId: string; item: TimelineItem }>> {
      if (!(await has('alerts', 'spray_plans', 'spray_plan_blocks'))) return [];
      const rows = await select<{ block_id: string; id: string; grade: string; state: string; product: string; raised_at: Date }>(
        `SELECT sb.block_id, al.id, al.grade, al.state, s.product_name AS product, al.raised_at
         FROM alerts al JOIN spray_plans s ON s.id = al.spray_plan_id JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id
         WHERE sb.block_id IN (:ids) AND al.${sideColumn(side)} = :orgId AND al.raised_at >= :from AND al.raised_at < :to`,
        { ids: blockIds.length ? blockIds : NO_IDS, orgId, from: clock.seasonFrom.toISOString(), to: clock.seasonTo.toISOString() },
      );
      return rows.map((r) => ({
        blockId: r.block_id,
        item: { kind: 'alert', id: r.id, label: `Alert (${r.grade}): ${r.product}`, start: iso(r.raised_at)!, end: null, state: r.state, openId: r.id },
      }));
    },

    /** The buffer around the sprayed blocks (the farm's spray buffer distance) of sprays under way or due soon. */
    async sprayBuffers(blockIds: string[], clock: SeasonClock): Promise<SeasonMapFeature[]> {
      if (!(await has('spray_plans', 'spray_plan_blocks'))) return [];
      const rows = await select<{ id: string; product: string; geometry: string | null; active: boolean; start: Date; buffer_m: number }>(
        `SELECT s.id, s.product_name AS product, s.exposure_window @> :now::timestamptz AS active, lower(s.planned_window) AS start, o.spray_buffer_m AS buffer_m,
           ST_AsGeoJSON(ST_Union(ST_Buffer(coalesce(b.outline, b.location)::geography, o.spray_buffer_m)::geometry), 6) AS geometry
         FROM spray_plans s JOIN spray_plan_blocks sb ON sb.spray_plan_id = s.id JOIN blocks b ON b.id = sb.block_id
         JOIN organizations o ON o.id = s.farm_id
         WHERE sb.block_id IN (:ids) AND s.state <> 'cancelled'
           AND s.exposure_window && tstzrange(:now::timestamptz, :until::timestamptz, '[)')
           AND coalesce(b.outline, b.location) IS NOT NULL
         GROUP BY s.id, o.spray_buffer_m`,
        {
          ids: blockIds.length ? blockIds : NO_IDS, now: clock.now.toISOString(),
          until: new Date(clock.now.getTime() + BUFFER_LOOKAHEAD_DAYS * 86_400_000).toISOString(),
        },
      );
      return rows
        .filter((r) => r.geometry)
        .map((r) => ({
          type: 'Feature' as const,
          id: `buffer-${r.id}`,
          geometry: JSON.parse(r.geometry!) as SeasonMapFeature['geometry'],
          properties: {
            kind: 'spray-buffer' as const, name: r.product, state: r.active ? 'spray-active' : 'spray-planned',
            detail: `${Math.round(Number(r.buffer_m))} m buffer · from ${iso(r.start)}`,
          },
        }));
    },
  };
}

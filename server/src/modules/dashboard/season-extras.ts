// The overview's parts that come from the spray, alert and invoice features: open alerts,
// upcoming sprays and pest trap checks, money owed or due, spray windows with their
// residual tail, and spray buffers (the SQL is in dashboard.queries.ts).
import type { AppContext } from '../../context.js';
import type { DashboardAlert, DashboardSpray, MoneyLine, PestTrapCheck, SeasonMapFeature, TimelineItem } from '../../../../shared/schemas/dashboard.js';
import type { SeasonClock } from './season-clock.js';
import {
  selectApiaryOpenAlerts, selectApiaryMoneyDue, selectTimelineSprays, selectTimelineAlerts, selectSprayBuffers,
  type OpenAlertRow, type TrapCountRow, type UpcomingSprayRow,
} from './dashboard.queries.js';
import { conflictGradeSet } from '../../../../shared/labels/sprays.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { zonedDateTime } from '../../../../shared/domain/zoned-time.js';

type Side = 'farm' | 'apiary';
/** How far ahead the map draws spray buffers. */
const BUFFER_LOOKAHEAD_DAYS = 14;

const isoOf = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

/** Open alerts as the overview lists them: what was sprayed where (and, for a beekeeper, at which farm). */
export function openAlertsOf(rows: OpenAlertRow[], side: Side): DashboardAlert[] {
  return rows.map((r) => ({
    id: r.id, severity: r.grade, state: r.state,
    title: side === 'farm' ? `${r.product} on ${r.blocks ?? 'a block'}` : `${r.product} at ${r.farm_name} (${r.blocks ?? 'a block'})`,
    raisedAt: isoOf(r.raised_at)!,
  }));
}

export function upcomingSpraysOf(rows: UpcomingSprayRow[]): DashboardSpray[] {
  return rows.map((r) => ({
    id: r.id, product: r.product, blockNames: r.blocks, plannedStart: isoOf(r.start)!, plannedEnd: isoOf(r.end)!,
    residualHours: r.rt25_hours, residualEnd: isoOf(r.residual_end)!, state: r.state,
  }));
}

export function pestTrapsOf(rows: TrapCountRow[]): PestTrapCheck[] {
  return rows.map((r) => ({ blockName: r.block_name, pest: r.pest, checkedOn: r.checked_on, moths: r.moths }));
}

export function createSeasonExtras(ctx: AppContext) {
  const db = ctx.sequelize;

  return {
    /** The open alerts that name the apiary business. */
    async apiaryOpenAlerts(apiaryId: string): Promise<DashboardAlert[] | null> {
      return openAlertsOf(await selectApiaryOpenAlerts(db, apiaryId), 'apiary');
    },

    /** The apiary's issued invoices not yet settled: total less succeeded payments and credit notes, plus succeeded refunds. */
    moneyDue(apiaryId: string): Promise<MoneyLine[] | null> {
      return selectApiaryMoneyDue(db, apiaryId);
    },

    async timelineSprays(blockIds: string[], clock: SeasonClock): Promise<Array<{ blockId: string; item: TimelineItem }>> {
      const rows = await selectTimelineSprays(db, { ids: blockIds, from: clock.seasonFrom.toISOString(), to: clock.seasonTo.toISOString() });
      return rows.map((r) => ({
        blockId: r.block_id,
        item: {
          kind: 'spray', id: r.id, label: r.state === 'applied' ? `${r.product} (applied)` : r.product, state: r.state,
          start: isoOf(r.applied_at ?? r.start)!, end: isoOf(r.end), residualEnd: isoOf(r.residual_end), openId: r.id,
        },
      }));
    },

    async timelineAlerts(blockIds: string[], orgId: string, side: Side, clock: SeasonClock): Promise<Array<{ blockId: string; item: TimelineItem }>> {
      const rows = await selectTimelineAlerts(db, side, { ids: blockIds, orgId, from: clock.seasonFrom.toISOString(), to: clock.seasonTo.toISOString() });
      return rows.map((r) => ({
        blockId: r.block_id,
        item: { kind: 'alert', id: r.id, label: `Spray alert (${labelOf(conflictGradeSet, r.grade)}): ${r.product}`, start: isoOf(r.raised_at)!, end: null, state: r.state, openId: r.id },
      }));
    },

    /** The buffer around the sprayed blocks (the farm's spray buffer distance) of sprays under way or due soon. */
    async sprayBuffers(blockIds: string[], clock: SeasonClock): Promise<SeasonMapFeature[]> {
      const rows = await selectSprayBuffers(db, {
        ids: blockIds, now: clock.now.toISOString(), until: new Date(clock.now.getTime() + BUFFER_LOOKAHEAD_DAYS * 86_400_000).toISOString(),
      });
      return rows
        .filter((r) => r.geometry)
        .map((r) => ({
          type: 'Feature' as const,
          id: `buffer-${r.id}`,
          geometry: JSON.parse(r.geometry!) as SeasonMapFeature['geometry'],
          properties: {
            kind: 'spray-buffer' as const, name: r.product, state: r.active ? 'spray-active' : 'spray-planned',
            detail: `${Math.round(r.buffer_m)} m buffer · from ${zonedDateTime(r.start, r.time_zone)} (${r.time_zone})`,
          },
        }));
    },
  };
}

// The season at a glance: what the grower, beekeeper and admin dashboards, the season
// timeline and the season map receive, and the few inputs they take.
import { z } from 'zod';

export const seasonQuery = z.object({
  season: z.coerce.number({ message: 'must be a year' }).int('must be a whole year').min(2000, 'must be 2000 or later').max(2100, 'must be 2100 or earlier').optional(),
});
export type SeasonQuery = z.infer<typeof seasonQuery>;

export const beekeeperDashboardQuery = z.object({
  days: z.coerce.number({ message: 'must be a number of days' }).int('must be whole days').min(1, 'must be at least 1').max(60, 'must be at most 60').default(7),
});
export type BeekeeperDashboardQuery = z.infer<typeof beekeeperDashboardQuery>;

export const coloniesOwnedBody = z.object({
  coloniesOwned: z.number({ message: 'must be a number of colonies' }).int('must be a whole number').min(0, 'cannot be negative').max(1_000_000, 'must be at most 1,000,000').nullable(),
});
export type ColoniesOwnedBody = z.infer<typeof coloniesOwnedBody>;

/** Money per currency, in integer cents. */
export interface MoneyLine {
  currency: string;
  cents: number;
  count: number;
}

export interface DashboardAlert {
  id: string;
  /** The conflict grade the alert feature gave. */
  severity: string;
  state: string;
  title: string;
  raisedAt: string;
}

export interface DashboardSpray {
  id: string;
  blockNames: string | null;
  product: string;
  plannedStart: string;
  plannedEnd: string;
  /** RT25 hours as entered; null when the product's residual time is unknown. */
  residualHours: number | null;
  /** End of the residual tail (end of the spray plus residual hours). */
  residualEnd: string;
  state: string;
}

/** The latest pheromone trap check per block and pest. */
export interface PestTrapCheck {
  blockName: string;
  pest: string;
  checkedOn: string;
  moths: number;
}

export interface GrowerBlockSummary {
  id: string;
  name: string;
  crop: string;
  acres: number;
  coloniesPerAcre: number;
  coloniesNeeded: number;
  coloniesPlanned: number;
  coloniesOnSite: number;
  bloomWindow: { bloomStart: string; fullBloom: string | null; petalFall: string } | null;
  /** Where the block stands on the dashboard's day. */
  bloomState: 'no-forecast' | 'before-bloom' | 'in-bloom' | 'after-bloom';
}

export interface GrowerDashboard {
  season: number;
  today: string;
  timeZone: string;
  blocks: GrowerBlockSummary[];
  totals: { coloniesNeeded: number; coloniesRequested: number; coloniesCommitted: number; coloniesOnSite: number };
  /** Null when the feature is not installed on this server. */
  openAlerts: DashboardAlert[] | null;
  upcomingSprays: DashboardSpray[] | null;
  pestTraps: PestTrapCheck[] | null;
  moneyOwed: MoneyLine[] | null;
}

export interface ColonyWeek {
  /** Monday of the week, YYYY-MM-DD in the business's time zone. */
  weekStart: string;
  committed: number;
  byFarm: Array<{ farmId: string; farmName: string; colonies: number }>;
}

export interface PlacementDue {
  placementId: string;
  agreementId: string;
  farmName: string;
  dropSiteName: string;
  blockName: string;
  colonies: number;
  dueAt: string;
  overdue: boolean;
}

export interface BeekeeperDashboard {
  season: number;
  today: string;
  timeZone: string;
  coloniesOwned: number | null;
  canEditColoniesOwned: boolean;
  weeks: ColonyWeek[];
  peakCommitted: number;
  dropOffsDue: PlacementDue[];
  pickupsDue: PlacementDue[];
  days: number;
  openAlerts: DashboardAlert[] | null;
  moneyDue: MoneyLine[] | null;
}

export type TimelineItemKind = 'bloom' | 'placement' | 'spray' | 'alert';

export interface TimelineItem {
  kind: TimelineItemKind;
  id: string;
  label: string;
  start: string;
  /** Null for a mark (alerts). */
  end: string | null;
  /** For sprays: the end of the residual tail (end of application + residual hours). */
  residualEnd?: string | null;
  state?: string;
  /** The record the item opens: the agreement of a placement, the block of a bloom window. */
  openId?: string | null;
}

export interface TimelineRow {
  blockId: string;
  blockName: string;
  farmName: string;
  crop: string;
  items: TimelineItem[];
}

export interface SeasonTimeline {
  season: number;
  timeZone: string;
  range: { from: string; to: string };
  rows: TimelineRow[];
}

export type MapFeatureKind = 'block' | 'drop-site' | 'yard' | 'spray-buffer';

export interface SeasonMapFeature {
  type: 'Feature';
  id: string;
  geometry: { type: 'Point' | 'Polygon' | 'MultiPolygon'; coordinates: unknown };
  properties: { kind: MapFeatureKind; name: string; state: string; detail: string };
}

export interface SeasonMap {
  season: number;
  type: 'FeatureCollection';
  features: SeasonMapFeature[];
}

export interface AdminOrganization {
  id: string;
  name: string;
  kind: 'farm' | 'apiary';
  timeZone: string;
  members: number;
  createdAt: string;
}

export interface AdminUser {
  id: string;
  name: string;
  email: string;
  role: string;
  organizationName: string | null;
  disabled: boolean;
  createdAt: string;
}

export interface AdminEmail {
  id: number;
  to: string[];
  subject: string;
  receivedAt: string;
  attachments: number;
}

export interface AdminQueue {
  name: string;
  /** Jobs by pg-boss state: created, retry, active, completed, cancelled, failed. */
  states: Record<string, number>;
  oldestWaitingAt: string | null;
}

/** A job that failed or waits for another try, with the error of its last try. */
export interface AdminFailingJob {
  queue: string;
  id: string;
  state: 'retry' | 'failed';
  tries: number;
  retryLimit: number;
  error: string | null;
  at: string;
}

export interface AdminQueueHealth {
  running: boolean;
  queues: AdminQueue[];
  failing: AdminFailingJob[];
}

// Blocks and their bloom windows: request bodies (zod) and the shapes the API answers with.
import { z } from 'zod';
import { idSchema, isoDateSchema, pointSchema, polygonSchema, type GeoPoint, type GeoPolygon } from './common.js';
import { cropKeys, type CropKey } from '../domain/crops.js';
import { degreeDayMethods, type DegreeDayMethod } from '../domain/degree-days.js';
import type { StagePrediction, SuggestedBloomWindow } from '../domain/bloom-forecast.js';
import type { FrostRisk } from '../domain/frost.js';
import type { StockingAdvice } from '../domain/stocking.js';

const optionalText = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`).nullable().optional()
  .transform((v) => (v === '' ? null : v));

const blockFields = {
  name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  crop: z.enum(cropKeys, { message: 'must be one of the listed crops' }),
  variety: optionalText(120),
  pollinizerVariety: optionalText(120),
  yearPlanted: z.number().int('must be a whole year').min(1900, 'must be 1900 or later').max(2100, 'must be 2100 or earlier').nullable().optional(),
  treesPerAcre: z.number().positive('must be above 0').max(10_000, 'must be at most 10,000').nullable().optional(),
  notes: optionalText(2000),
  outline: polygonSchema.nullable().optional(),
  location: pointSchema.nullable().optional(),
  enteredAcres: z.number().positive('must be above 0').max(100_000, 'must be at most 100,000').nullable().optional(),
  coloniesPerAcre: z.number().min(0, 'must be 0 or more').max(50, 'must be at most 50').optional(),
  weatherStationId: idSchema.nullable().optional(),
  degreeDayStart: isoDateSchema.nullable().optional(),
};

export const blockBody = z.object(blockFields).superRefine((b, ctx) => {
  if (!b.outline && !b.enteredAcres) ctx.addIssue({ code: 'custom', path: ['enteredAcres'], message: 'draw or upload an outline, or enter the acreage' });
});
export type BlockBody = z.input<typeof blockBody>;

export const blockPatch = z.object(blockFields).partial();
export type BlockPatch = z.input<typeof blockPatch>;

export const bloomWindowBody = z
  .object({
    season: z.number().int().min(2000).max(2100).optional(),
    bloomStart: isoDateSchema,
    fullBloom: isoDateSchema.nullable().optional(),
    petalFall: isoDateSchema,
    confidenceNote: optionalText(500),
  })
  .superRefine((w, ctx) => {
    if (w.petalFall < w.bloomStart) ctx.addIssue({ code: 'custom', path: ['petalFall'], message: 'must be on or after the start of bloom' });
    if (w.fullBloom && (w.fullBloom < w.bloomStart || w.fullBloom > w.petalFall)) {
      ctx.addIssue({ code: 'custom', path: ['fullBloom'], message: 'must be between the start of bloom and petal fall' });
    }
  });
export type BloomWindowBody = z.input<typeof bloomWindowBody>;

const numberParam = z.coerce.number({ message: 'must be a number' });
export const forecastQuery = z
  .object({
    method: z.enum(degreeDayMethods as [DegreeDayMethod, ...DegreeDayMethod[]]).optional(),
    lowerF: numberParam.min(-40).max(120).optional(),
    upperF: numberParam.min(-40).max(150).optional(),
    from: isoDateSchema.optional(),
  })
  .refine((q) => q.upperF === undefined || q.lowerF === undefined || q.upperF > q.lowerF, { path: ['upperF'], message: 'must be above the lower threshold' });
export type ForecastQuery = z.infer<typeof forecastQuery>;

export interface BloomWindowDto {
  id: string;
  blockId: string;
  season: number;
  bloomStart: string;
  fullBloom: string | null;
  petalFall: string;
  confidenceNote: string | null;
  /** Who revised it, by name only: the window is shown to the apiary businesses that follow the block. */
  revisedBy: { name: string } | null;
  createdAt: string;
}

export interface BlockDto {
  id: string;
  farmId: string;
  name: string;
  crop: CropKey;
  variety: string | null;
  pollinizerVariety: string | null;
  yearPlanted: number | null;
  treesPerAcre: number | null;
  notes: string | null;
  outline: GeoPolygon | null;
  location: GeoPoint | null;
  enteredAcres: number | null;
  areaM2: number;
  acres: number;
  /** 'outline' when the acreage is computed from the outline (geodesic area), else 'entered'. */
  areaSource: 'outline' | 'entered';
  coloniesPerAcre: number;
  coloniesNeeded: number;
  stocking: { min: number; max: number; typical: number; source: string; note: string | null; advice: StockingAdvice };
  weatherStationId: string | null;
  weatherStationName: string | null;
  degreeDayStart: string | null;
  bloomWindow: BloomWindowDto | null;
  createdAt: string;
  updatedAt: string;
}

export interface DegreeDayPoint {
  day: string;
  degreeDays: number;
  cumulative: number;
  estimated: boolean;
}

export interface FrostCriticalForStage {
  /** Degree-day stage key and name, with the source of its threshold. */
  stage: string;
  stageName: string;
  stageSource: string;
  /** The critical-temperature row used, its values (°C) and its source. */
  stageLabel: string;
  kill10C: number;
  kill90C: number;
  source: string;
}

export interface BlockForecastDto {
  blockId: string;
  stationId: string | null;
  /** Degree days are in °F (as the thresholds are published); convert x 5/9 to show °C. */
  unit: 'F';
  method: DegreeDayMethod;
  lowerF: number;
  upperF: number | null;
  from: string;
  series: DegreeDayPoint[];
  /** How the days after the last observation were estimated, or null when none were. */
  extension: null | { kind: 'station-normals' | 'simple-normal'; fromDay: string; description: string };
  thresholds: Array<{ id: string; stage: string; label: string; ddLow: number; ddHigh: number; source: string; farmOwn: boolean }>;
  predictions: StagePrediction[];
  suggestedWindow: SuggestedBloomWindow | null;
  currentStage: { stage: string; label: string } | null;
  cumulativeToDate: number;
  /** The critical bud temperatures of the current stage: the degree-day stage, the table row used, and their sources. */
  frostCritical: FrostCriticalForStage | null;
  /** The worst forecast low at or below the critical temperatures of the stage predicted for its day, naming that stage. */
  frost: null | (FrostCriticalForStage & { risk: Exclude<FrostRisk, 'none'>; day: string; lowC: number });
  /** Why no forecast could be made (no station, no thresholds for the crop ...). */
  notes: string[];
}

/** Sent live to the farm and every apiary holding or offering colonies for the block. */
export interface BloomRevisedEvent {
  blockId: string;
  blockName: string;
  farmId: string;
  farmName: string;
  crop: string;
  window: BloomWindowDto;
  previous: { bloomStart: string; fullBloom: string | null; petalFall: string } | null;
}

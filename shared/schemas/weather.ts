// Weather stations, daily temperatures, forecast lows and reference data (stage
// thresholds, frost critical temperatures): request bodies and answer shapes.
import { z } from 'zod';
import { idSchema, isoDateSchema, pointSchema, timeZoneSchema, type GeoPoint } from './common.js';
import { degreeDayMethods, type DegreeDayMethod } from '../domain/degree-days.js';

export const temperatureUnits = ['F', 'C'] as const;
export type TemperatureUnit = (typeof temperatureUnits)[number];
export const temperatureUnitSchema = z.enum(temperatureUnits, { message: 'must be F or C' });

/** Plausible air temperatures, °C; the same bounds in °F are -76..140. */
export const TEMPERATURE_BOUNDS_C = { min: -60, max: 60 } as const;

export const stationBody = z.object({
  name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  location: pointSchema,
  timeZone: timeZoneSchema,
});
export type StationBody = z.input<typeof stationBody>;
export const stationPatch = stationBody.partial();

const temperature = z.number({ message: 'must be a number' });
export const dailyTemperatureBody = z
  .object({ tmin: temperature, tmax: temperature, unit: temperatureUnitSchema })
  .superRefine((t, ctx) => {
    if (t.tmin > t.tmax) ctx.addIssue({ code: 'custom', path: ['tmin'], message: 'must not be above the maximum' });
  });
export type DailyTemperatureBody = z.input<typeof dailyTemperatureBody>;

export const forecastLowBody = z.object({ low: temperature, unit: temperatureUnitSchema });
export type ForecastLowBody = z.input<typeof forecastLowBody>;

export const stationDayParams = z.object({ id: idSchema, day: isoDateSchema });

export const temperatureUploadFields = z.object({
  unit: temperatureUnitSchema,
  skipBadLines: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
});

export const temperaturesQuery = z.object({ from: isoDateSchema.optional(), to: isoDateSchema.optional() });
export const chillQuery = z.object({ from: isoDateSchema.optional() });

export interface StationDto {
  id: string;
  farmId: string;
  name: string;
  location: GeoPoint;
  timeZone: string;
  days: number;
  firstDay: string | null;
  lastDay: string | null;
  createdAt: string;
}

export interface DailyTemperatureDto {
  day: string;
  tminC: number;
  tmaxC: number;
  source: 'upload' | 'manual';
}

export interface ForecastLowDto {
  day: string;
  lowC: number;
}

export interface UploadLineError {
  line: number;
  field: 'date' | 'tmin' | 'tmax' | 'low';
  message: string;
}

export interface UploadResult {
  saved: number;
  replaced: number;
  skipped: UploadLineError[];
}

export interface ChillDto {
  stationId: string;
  /** The day chill is counted from (the model's fall start, or the day asked for). */
  from: string;
  /** Where the search for the fall start began (September 1). */
  searchedFrom: string;
  startRule: string;
  model: 'utah';
  source: string;
  total: number;
  series: Array<{ day: string; units: number; cumulative: number }>;
}

export const stageThresholdBody = z
  .object({
    crop: z.string().trim().min(1, 'is required').max(60),
    variety: z.string().trim().max(120).nullable().optional(),
    stage: z.string().regex(/^[a-z][a-z-]*$/, 'must be lower-case letters and dashes, e.g. petal-fall'),
    label: z.string().trim().min(1, 'is required').max(80),
    sortOrder: z.number().int().min(0).max(100).default(0),
    baseF: z.number().min(-40).max(120),
    upperF: z.number().min(-40).max(150).nullable().optional(),
    method: z.enum(degreeDayMethods as [DegreeDayMethod, ...DegreeDayMethod[]]).default('average'),
    startMonthDay: z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12][0-9]|3[01])$/, 'must be MM-DD').default('03-01'),
    ddLowF: z.number().min(0, 'must be 0 or more').max(10_000),
    ddHighF: z.number().min(0, 'must be 0 or more').max(10_000),
    source: z.string().trim().min(3, 'name the source (or "own observation")').max(500),
  })
  .superRefine((t, ctx) => {
    if (t.ddHighF < t.ddLowF) ctx.addIssue({ code: 'custom', path: ['ddHighF'], message: 'must not be below the low end' });
    if (t.upperF != null && t.upperF <= t.baseF) ctx.addIssue({ code: 'custom', path: ['upperF'], message: 'must be above the base temperature' });
  });
export type StageThresholdBody = z.input<typeof stageThresholdBody>;

export const stageThresholdPatch = z
  .object({
    label: z.string().trim().min(1, 'is required').max(80).optional(),
    ddLowF: z.number().min(0, 'must be 0 or more').max(10_000).optional(),
    ddHighF: z.number().min(0, 'must be 0 or more').max(10_000).optional(),
    source: z.string().trim().min(3, 'name the source (or "own observation")').max(500).optional(),
  })
  .refine((t) => t.ddLowF === undefined || t.ddHighF === undefined || t.ddHighF >= t.ddLowF, { path: ['ddHighF'], message: 'must not be below the low end' });

export const thresholdsQuery = z.object({ crop: z.string().max(60).optional() });

export interface StageThresholdDto {
  id: string;
  farmId: string | null;
  crop: string;
  variety: string | null;
  stage: string;
  label: string;
  sortOrder: number;
  baseF: number;
  upperF: number | null;
  method: DegreeDayMethod;
  startMonthDay: string;
  ddLowF: number;
  ddHighF: number;
  source: string;
}

export const frostCriticalPatch = z
  .object({
    kill10F: z.number().min(-40).max(40).optional(),
    kill90F: z.number().min(-40).max(40).optional(),
    source: z.string().trim().min(3).max(500).optional(),
  })
  .refine((t) => t.kill10F === undefined || t.kill90F === undefined || t.kill90F <= t.kill10F, { path: ['kill90F'], message: 'must not be above the 10% kill temperature' });

export interface FrostCriticalDto {
  id: string;
  crop: string;
  stageLabel: string;
  stage: string | null;
  sortOrder: number;
  kill10F: number;
  kill90F: number;
  source: string;
}

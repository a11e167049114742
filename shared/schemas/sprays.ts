// Spray plans: the input the form sends (also used by the dry-run check) and the DTOs back.
import { z } from 'zod';
import { idSchema, isoDateTimeSchema, maxWindowDays, windowAtMost } from './common.js';
import type { BeeToxicityClass } from '../domain/bee-toxicity.js';
import type { ConflictGrade } from '../domain/conflict-grading.js';

export const sprayStates = ['planned', 'applied', 'cancelled'] as const;
export type SprayState = (typeof sprayStates)[number];

/** EPA registration number: company number, product number, optional distributor number (e.g. 1234-56 or 1234-56-7890). */
export const epaRegNoPattern = /^[0-9]{1,7}-[0-9]{1,7}(-[0-9]{1,7})?$/;
export const epaRegNoSchema = z
  .string()
  .trim()
  .regex(epaRegNoPattern, 'must be an EPA registration number: company-product, optional distributor (e.g. 1234-56 or 1234-56-7890)');

const optionalText = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`).nullish().transform((v) => (v ? v : null));

const sprayFields = {
  blockIds: z.array(idSchema).min(1, 'choose at least one block').max(200, 'at most 200 blocks'),
  startsAt: isoDateTimeSchema,
  endsAt: isoDateTimeSchema,
  productName: z.string().trim().min(1, 'enter the product name').max(160, 'must be at most 160 characters'),
  epaRegNo: epaRegNoSchema.nullish().or(z.literal('').transform(() => null)).transform((v) => v ?? null),
  activeIngredients: z.array(z.string().trim().min(1).max(120)).max(10, 'at most 10 ingredients').default([]),
  ld50UgPerBee: z.number({ message: 'must be a number of µg per bee' }).min(0, 'must be zero or more').max(100000, 'is too large').nullish().transform((v) => v ?? null),
  rt25Hours: z.number({ message: 'must be a number of hours' }).min(0, 'must be zero or more').max(2000, 'is too large').nullish().transform((v) => v ?? null),
  targetPest: optionalText(160),
  applicatorName: optionalText(160),
  notes: optionalText(4000),
};

const windowRule = <T extends { startsAt?: string; endsAt?: string }>(v: T) => !v.startsAt || !v.endsAt || new Date(v.endsAt) > new Date(v.startsAt);
const windowIssue = { message: 'must be after the start', path: ['endsAt'] };

const windowLength = windowAtMost('startsAt', 'endsAt', maxWindowDays.spray);

export const sprayInputSchema = z.object(sprayFields).refine(windowRule, windowIssue).refine(...windowLength);
export type SprayInput = z.infer<typeof sprayInputSchema>;

/** A change to a plan (moving it is a change of startsAt/endsAt); both times are sent together. */
export const sprayUpdateSchema = z
  .object(sprayFields)
  .partial()
  .refine((v) => (v.startsAt === undefined) === (v.endsAt === undefined), { message: 'send the start and the end together', path: ['endsAt'] })
  .refine(windowRule, windowIssue)
  .refine(...windowLength);
export type SprayUpdate = z.infer<typeof sprayUpdateSchema>;

export const sprayApplySchema = z.object({ appliedAt: isoDateTimeSchema });
export type SprayApply = z.infer<typeof sprayApplySchema>;

export const sprayListQuery = z.object({ state: z.enum(sprayStates).optional() });

export interface ConflictColonies {
  apiaryId: string;
  apiaryName: string;
  colonies: number;
  distanceM: number;
  dropSites: Array<{ id: string; name: string; blockName: string; lon: number; lat: number; colonies: number; distanceM: number; placed: boolean }>;
}

/** One graded finding of the conflict check. */
export interface SprayConflict {
  apiaryId: string | null;
  apiaryName: string | null;
  grade: ConflictGrade;
  grades: ConflictGrade[];
  reasons: string[];
  colonies: ConflictColonies | null;
}

export interface SprayHazardDto {
  toxicityClass: BeeToxicityClass;
  acutelyToxic: boolean;
  extendedResidual: boolean;
  residualHours: number;
  assumed: { ld50: boolean; rt25: boolean };
}

export interface SprayCheckResult {
  hazard: SprayHazardDto;
  exposureEndsAt: string;
  bufferM: number;
  duringBloom: boolean;
  conflicts: SprayConflict[];
  cautions: string[];
}

export interface SprayBlockDto {
  id: string;
  name: string;
  outline: { type: 'Polygon'; coordinates: number[][][] } | null;
  lon: number;
  lat: number;
}

export interface SprayDto {
  id: string;
  farmId: string;
  state: SprayState;
  startsAt: string;
  endsAt: string;
  appliedAt: string | null;
  productName: string;
  epaRegNo: string | null;
  activeIngredients: string[];
  ld50UgPerBee: number | null;
  rt25Hours: number | null;
  targetPest: string | null;
  applicatorName: string | null;
  notes: string | null;
  blocks: SprayBlockDto[];
  hazard: SprayHazardDto;
  openAlerts: number;
  createdAt: string;
  updatedAt: string;
}

export interface SprayWithCheck {
  spray: SprayDto;
  check: SprayCheckResult;
  /** The farm's buffer around the sprayed blocks (GeoJSON geometry), for the map. */
  buffer: { type: 'Polygon' | 'MultiPolygon'; coordinates: unknown[] } | null;
}

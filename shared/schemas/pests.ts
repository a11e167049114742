// Pheromone trap counts and pest timing.
import { z } from 'zod';
import { idSchema, isoDateSchema } from './common.js';
import type { PestTiming } from '../domain/pest-timing.js';
import type { SuggestedSprayDay } from '../domain/spray-windows.js';

export const trapCountInputSchema = z.object({
  blockId: idSchema,
  pestModelId: z.string().trim().min(1, 'choose a pest').max(60),
  checkedOn: isoDateSchema,
  moths: z.number({ message: 'must be a whole number of moths' }).int('must be a whole number').min(0, 'must be zero or more').max(100000, 'is too large'),
});
export type TrapCountInput = z.infer<typeof trapCountInputSchema>;

export const pestBlockQuery = z.object({ blockId: idSchema, pestModelId: z.string().trim().min(1).max(60).default('codling-moth') });
/** The farm's season (calendar year); this season when left out. */
export const pestTimingQuery = pestBlockQuery.extend({
  season: z.coerce.number({ message: 'must be a year' }).int('must be a whole year').min(2000, 'must be 2000 or later').max(2100, 'must be 2100 or earlier').optional(),
});

export interface PestModelDto {
  id: string; name: string; lowerThresholdF: number; upperThresholdF: number; method: string; cutoff: string; biofixRule: string;
  stages: Array<{ name: string; degreeDaysF: number }>; source: string;
}
export interface TrapCountDto { id: string; blockId: string; pestModelId: string; checkedOn: string; moths: number }
export interface PestTimingDto extends PestTiming {
  pestModelId: string;
  blockId: string;
  hasWeather: boolean;
  /** Seasons with trap checks (and this one), newest first. */
  seasons: number[];
  suggestedSprayDays: SuggestedSprayDay[];
  sprayWindowCaution: string;
}

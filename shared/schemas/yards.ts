// Beekeepers' yards (home locations): input and answer shapes.
import { z } from 'zod';
import { pointSchema, type GeoPoint } from './common.js';

export const yardBody = z.object({
  name: z.string().trim().min(1, 'is required').max(120, 'is at most 120 characters'),
  location: pointSchema,
  colonies: z.int('must be a whole number').min(0, 'must be zero or more').max(100_000).nullable().optional(),
  notes: z.string().trim().max(1000).nullable().optional(),
});
export type YardBody = z.infer<typeof yardBody>;

export interface YardDto {
  id: string;
  name: string;
  location: GeoPoint;
  colonies: number | null;
  notes: string | null;
}

// Small zod pieces reused by the feature schemas.
import { z } from 'zod';

export const idSchema = z.uuid({ message: 'must be a valid id' });
export const idParams = z.object({ id: idSchema });
export type IdParams = z.infer<typeof idParams>;

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'must be an e-mail address' })).pipe(z.string().max(254));
export const isoDateSchema = z.iso.date({ message: 'must be a date (YYYY-MM-DD)' });
export const isoDateTimeSchema = z.iso.datetime({ offset: true, message: 'must be a date and time (ISO 8601)' });

export const unitsSchema = z.enum(['imperial', 'metric']);
export type Units = z.infer<typeof unitsSchema>;

export const timeZoneSchema = z.string().refine((zone) => {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}, 'must be an IANA time zone, e.g. America/Los_Angeles');

/** GeoJSON Point in WGS 84 (longitude, latitude). */
export const pointSchema = z.object({
  type: z.literal('Point'),
  coordinates: z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)]),
});
export type GeoPoint = z.infer<typeof pointSchema>;

/** GeoJSON Polygon in WGS 84; each ring closed with at least four positions. */
export const polygonSchema = z.object({
  type: z.literal('Polygon'),
  coordinates: z
    .array(
      z
        .array(z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)]))
        .min(4, 'a ring needs at least four positions (first repeated last)')
        .refine((ring) => ring[0][0] === ring.at(-1)![0] && ring[0][1] === ring.at(-1)![1], 'a ring must end where it starts'),
    )
    .min(1, 'a polygon needs an outer ring'),
});
export type GeoPolygon = z.infer<typeof polygonSchema>;

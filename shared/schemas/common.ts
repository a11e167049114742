// Small zod pieces reused by the feature schemas.
import { z } from 'zod';

export const idSchema = z.uuid({ message: 'must be a valid id' });
export const idParams = z.object({ id: idSchema });
export type IdParams = z.infer<typeof idParams>;

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'must be an e-mail address' })).pipe(z.string().max(254));
/**
 * The years the trade deals in. PostgreSQL refuses year 0 and JavaScript dates end in
 * 275760, so a date outside a sensible range would pass a format check and fail later;
 * nothing in pollination (orchards planted, seasons planned, payments) lies before 1900
 * or after 2200.
 */
export const tradeYears = { from: 1900, to: 2200 } as const;
const tradeYearsMessage = `must be between ${tradeYears.from} and ${tradeYears.to}`;
/** True when an ISO date or date-time (YYYY-MM-DD...) falls within tradeYears. */
export function inTradeYears(iso: string): boolean {
  const year = Number(iso.slice(0, 4));
  return /^\d{4}-/.test(iso) && year >= tradeYears.from && year <= tradeYears.to;
}

export const isoDateSchema = z.iso.date({ message: 'must be a date (YYYY-MM-DD)' }).refine(inTradeYears, tradeYearsMessage);
export const isoDateTimeSchema = z.iso.datetime({ offset: true, message: 'must be a date and time (ISO 8601)' }).refine(inTradeYears, tradeYearsMessage);

/**
 * Longest windows, in days. A spray plan is one application (hours, at most a few days
 * for a large farm), so a month leaves room for weather delays; a placement, a request or
 * a look-up of observed temperatures covers one season, and a year plus a day covers any
 * season, including one that crosses New Year (southern hemisphere, almonds in February).
 */
export const maxWindowDays = { spray: 31, season: 366 } as const;
const dayMs = 86_400_000;

/** True unless both ends are given and the end lies more than `days` after the start. */
export function isDaysApartAtMost(from: unknown, to: unknown, days: number): boolean {
  if (typeof from !== 'string' || typeof to !== 'string') return true;
  return !(Date.parse(to) - Date.parse(from) > days * dayMs);
}

/** A refinement (spread it into .refine) for objects with a start and an end at most `days` apart. */
export function windowAtMost<K extends string>(fromKey: K, toKey: K, days: number): [(value: Partial<Record<K, unknown>>) => boolean, { message: string; path: string[] }] {
  return [
    (value) => isDaysApartAtMost(value[fromKey], value[toKey], days),
    { message: `must be at most ${days} days after ${fromKey}`, path: [toKey] },
  ];
}

/**
 * The dotted paths of every string (and object key) in a value that holds a NUL character,
 * which PostgreSQL text cannot store. Walks with its own stack, so a body nested
 * thousands of levels deep cannot overflow the call stack.
 */
export function nulPaths(value: unknown): string[] {
  type Step = { key: string; parent: Step | null } | null;
  const pathOf = (step: Step, last?: string) => {
    const keys = last === undefined ? [] : [last];
    for (let at = step; at; at = at.parent) keys.push(at.key);
    return keys.reverse().join('.') || 'body';
  };
  const found: string[] = [];
  const stack: Array<{ value: unknown; at: Step }> = [{ value, at: null }];
  while (stack.length) {
    const { value: item, at } = stack.pop()!;
    if (typeof item === 'string') {
      if (item.includes('\u0000')) found.push(pathOf(at));
    } else if (item && typeof item === 'object') {
      for (const [key, child] of Object.entries(item)) {
        if (key.includes('\u0000')) found.push(pathOf(at, key.replace(/\u0000/g, '')));
        else stack.push({ value: child, at: { key, parent: at } });
      }
    }
  }
  return found.reverse();
}
export const nulMessage = 'must not contain a NUL character';

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

type Position = [number, number];

/**
 * The widest a block outline may be, in km, east-west or north-south. The largest single
 * orchard or seed blocks are a few hundred acres (a 640-acre section is 1.6 km a side);
 * 10 km leaves wide room while refusing a slip that outlines a county or the whole world,
 * whose area PostGIS cannot work out on the sphere.
 */
export const maxBlockExtentKm = 10;
const kmPerDegree = 111.32;

function extentKm(ring: Position[]): number {
  const lons = ring.map((p) => p[0]);
  const lats = ring.map((p) => p[1]);
  const midLat = ((Math.min(...lats) + Math.max(...lats)) / 2) * (Math.PI / 180);
  const northSouth = (Math.max(...lats) - Math.min(...lats)) * kmPerDegree;
  const eastWest = (Math.max(...lons) - Math.min(...lons)) * kmPerDegree * Math.cos(midLat);
  return Math.max(northSouth, eastWest);
}

const cross = (o: Position, a: Position, b: Position) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
function segmentsCross(a: Position, b: Position, c: Position, d: Position): boolean {
  const d1 = cross(c, d, a), d2 = cross(c, d, b), d3 = cross(a, b, c), d4 = cross(a, b, d);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}
/** True when two edges of a closed ring that do not share a corner cross each other (a bow tie). */
function selfIntersects(ring: Position[]): boolean {
  const n = ring.length - 1;
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      if (segmentsCross(ring[i], ring[i + 1], ring[j], ring[j + 1])) return true;
    }
  }
  return false;
}
const distinctPositions = (ring: Position[]) => new Set(ring.map((p) => `${p[0]},${p[1]}`)).size;

/** GeoJSON Polygon in WGS 84; each ring closed with at least four positions, not crossing itself, and of a block's size. */
export const polygonSchema = z.object({
  type: z.literal('Polygon'),
  coordinates: z
    .array(
      z
        .array(z.tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)]))
        .min(4, 'a ring needs at least four positions (first repeated last)')
        .max(5000, 'a ring has at most 5000 positions')
        .superRefine((ring, ctx) => {
          // Zod runs these checks even after a failed length check: look only at rings long enough.
          if (ring.length < 4) return;
          const problem =
            ring[0][0] !== ring.at(-1)![0] || ring[0][1] !== ring.at(-1)![1] ? 'a ring must end where it starts'
            : distinctPositions(ring) < 3 ? 'a ring needs at least three different corners'
            : null;
          if (problem) ctx.addIssue({ code: 'custom', message: problem });
        }),
    )
    .min(1, 'a polygon needs an outer ring')
    .max(50, 'a polygon has at most 50 rings'),
}).superRefine((polygon, ctx) => {
  // Size and crossing concern the outline as a whole, so the message names the outline itself.
  const rings = polygon.coordinates.filter((ring) => ring.length >= 4);
  const problem =
    rings.some((ring) => extentKm(ring) > maxBlockExtentKm) ? `a block outline is at most ${maxBlockExtentKm} km across`
    : rings.some((ring) => selfIntersects(ring)) ? 'is not a valid polygon: an outline must not cross itself'
    : null;
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});
export type GeoPolygon = z.infer<typeof polygonSchema>;

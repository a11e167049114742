// Degree days and chill units: the heat and cold a crop has accumulated, from daily
// minimum and maximum temperatures. Methods as published by UC IPM (Zalom et al. 1983,
// UC DANR Leaflet 21373): average, single triangle (Sevacherian et al. 1977) and single
// sine (Baskerville & Emin 1969), each with an optional upper threshold and horizontal
// cutoff. Chill units: Utah model (Richardson et al. 1974).

export type DegreeDayMethod = 'average' | 'triangle' | 'sine';
export const degreeDayMethods: readonly DegreeDayMethod[] = ['average', 'triangle', 'sine'];

/** Heat above threshold t under a single triangle through (Tmin, Tmax). */
function triangleAbove(tmin: number, tmax: number, t: number): number {
  if (tmin >= t) return (tmax + tmin) / 2 - t;
  if (tmax <= t) return 0;
  return (tmax - t) ** 2 / (2 * (tmax - tmin));
}

/** Heat above threshold t under a single sine wave through (Tmin, Tmax). */
function sineAbove(tmin: number, tmax: number, t: number): number {
  const mean = (tmax + tmin) / 2;
  if (tmin >= t) return mean - t;
  if (tmax <= t) return 0;
  const amplitude = (tmax - tmin) / 2;
  const theta = Math.asin((t - mean) / amplitude);
  return ((mean - t) * (Math.PI / 2 - theta) + amplitude * Math.cos(theta)) / Math.PI;
}

/**
 * One day's degree days (same unit in, same unit out). `upper` null means no upper
 * threshold; otherwise development above it counts as at it (horizontal cutoff).
 */
export function dailyDegreeDays(tmin: number, tmax: number, lower: number, upper: number | null, method: DegreeDayMethod): number {
  if (tmin > tmax) throw new RangeError('tmin must not be above tmax');
  if (upper !== null && upper <= lower) throw new RangeError('upper threshold must be above the lower threshold');
  if (method === 'average') {
    const cap = (v: number) => (upper === null ? v : Math.min(v, upper));
    return Math.max(0, (cap(tmax) + cap(tmin)) / 2 - lower);
  }
  const above = method === 'triangle' ? triangleAbove : sineAbove;
  const dd = above(tmin, tmax, lower) - (upper === null ? 0 : above(tmin, tmax, upper));
  return Math.max(0, dd);
}

export interface DailyTemperature {
  /** Calendar day, YYYY-MM-DD. */
  day: string;
  tmin: number;
  tmax: number;
  /** True when the value is an estimate (normals), not an observation. */
  estimated?: boolean;
}

export interface AccumulatedDay extends DailyTemperature {
  degreeDays: number;
  cumulative: number;
}

/** Degree days accumulated day by day from `from` (a start date or a biofix), inclusive. */
export function accumulateDegreeDays(
  days: readonly DailyTemperature[],
  options: { lower: number; upper: number | null; method: DegreeDayMethod; from: string },
): AccumulatedDay[] {
  let cumulative = 0;
  return [...days]
    .filter((d) => d.day >= options.from)
    .sort((a, b) => a.day.localeCompare(b.day))
    .map((d) => {
      const degreeDays = dailyDegreeDays(d.tmin, d.tmax, options.lower, options.upper, options.method);
      cumulative += degreeDays;
      return { ...d, degreeDays, cumulative };
    });
}

/**
 * Utah chill units for one hour at tempF (Richardson et al. 1974): up to 34 °F 0;
 * above 34 to 36 0.5; above 36 to 48 1; above 48 to 54 0.5; above 54 to 60 0;
 * above 60 to 65 -0.5; above 65 -1.
 */
export function utahChillUnits(tempF: number): number {
  if (tempF <= 34) return 0;
  if (tempF <= 36) return 0.5;
  if (tempF <= 48) return 1;
  if (tempF <= 54) return 0.5;
  if (tempF <= 60) return 0;
  if (tempF <= 65) return -0.5;
  return -1;
}

/**
 * An estimated hourly course of one day from its minimum and maximum: a cosine with the
 * minimum at 05:00 and the maximum at 15:00 (a simple approximation; stations that log
 * hourly temperatures do better).
 */
export function hourlyTemperatures(tmin: number, tmax: number): number[] {
  const mean = (tmin + tmax) / 2;
  const amplitude = (tmax - tmin) / 2;
  return Array.from({ length: 24 }, (_, hour) => {
    // Rising 05:00 -> 15:00 (10 h), falling 15:00 -> 05:00 (14 h).
    const phase = hour >= 5 && hour <= 15 ? (hour - 5) / 10 : ((hour + 24 - 15) % 24) / 14 + 1;
    return mean - amplitude * Math.cos(Math.PI * phase);
  });
}

/** Utah chill units of one day from its minimum and maximum in °F (estimated hours). */
export function dailyChillUnits(tminF: number, tmaxF: number): number {
  return hourlyTemperatures(tminF, tmaxF).reduce((sum, t) => sum + utahChillUnits(t), 0);
}

export interface ChillDay {
  day: string;
  units: number;
  cumulative: number;
}

export const UTAH_CHILL_START_RULE = 'Counted from the day after the fall total (from September 1) is most negative, as in the Utah model (Richardson, Seeley & Walker 1974, HortScience 9:331–332; from memory of the paper)';

/**
 * Utah chill units of a winter, started as the model's authors start them: summed from a
 * provisional start (September 1), the total first falls while warm fall days undo chill;
 * counting begins the day after it is most negative in the fall (before January 1), or at
 * the provisional start when it never goes below zero. Days in °F; sorted by day.
 */
export function utahChillFromFall(days: ReadonlyArray<{ day: string; tminF: number; tmaxF: number }>, provisionalStart: string): { from: string; total: number; series: ChillDay[] } {
  const fallEnds = `${Number(provisionalStart.slice(0, 4)) + 1}-01-01`;
  const sorted = [...days].filter((d) => d.day >= provisionalStart).sort((a, b) => a.day.localeCompare(b.day));
  const units = sorted.map((d) => dailyChillUnits(d.tminF, d.tmaxF));
  let running = 0;
  let lowest = 0;
  let startIndex = 0;
  sorted.forEach((d, i) => {
    running += units[i];
    if (d.day < fallEnds && running < lowest - 1e-9) {
      lowest = running;
      startIndex = i + 1;
    }
  });
  let cumulative = 0;
  const series = sorted.slice(startIndex).map((d, i) => {
    cumulative += units[startIndex + i];
    return { day: d.day, units: units[startIndex + i], cumulative };
  });
  const from = startIndex === 0 ? provisionalStart : series[0]?.day ?? nextDay(sorted[startIndex - 1].day);
  return { from, total: cumulative, series };
}

function nextDay(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return d.toISOString().slice(0, 10);
}

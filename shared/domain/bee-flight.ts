// When honey bees fly, for spray timing: by default from 2 h before sunrise to 1 h after
// sunset (the widest of the published rules of thumb; California bee-protection guidance),
// configurable. Sunrise and sunset come from suncalc (upper limb, altitude -0.833°).
import { getTimes } from 'suncalc';

export interface BeeFlightSettings {
  hoursBeforeSunrise: number;
  hoursAfterSunset: number;
}

export const defaultBeeFlight: BeeFlightSettings = { hoursBeforeSunrise: 2, hoursAfterSunset: 1 };
export const beeFlightSource = 'Bees usually fly from about 2 h before sunrise to 1 h after sunset (California bee-protection guidance; a rule of thumb).';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

export interface SunDay {
  sunrise: Date | null;
  sunset: Date | null;
  alwaysUp: boolean;
  alwaysDown: boolean;
}

/** Sunrise and sunset of the solar day around `date` at a place. */
export function sunDay(date: Date, lat: number, lon: number): SunDay {
  const times = getTimes(date, lat, lon);
  return { sunrise: times.sunrise, sunset: times.sunset, alwaysUp: Boolean(times.alwaysUp), alwaysDown: Boolean(times.alwaysDown) };
}

/** The bees' flying hours of the solar day around `date`, or null when the sun stays down. */
export function beeFlightWindow(date: Date, lat: number, lon: number, settings: BeeFlightSettings = defaultBeeFlight): { from: Date; to: Date } | null {
  const day = sunDay(date, lat, lon);
  if (day.sunrise && day.sunset) {
    return { from: new Date(day.sunrise.getTime() - settings.hoursBeforeSunrise * HOUR_MS), to: new Date(day.sunset.getTime() + settings.hoursAfterSunset * HOUR_MS) };
  }
  if (day.alwaysUp) {
    const noon = getTimes(date, lat, lon).solarNoon.getTime();
    return { from: new Date(noon - DAY_MS / 2), to: new Date(noon + DAY_MS / 2) };
  }
  return null;
}

function assertPlace(lat: number, lon: number) {
  if (!Number.isFinite(lat) || lat < -90 || lat > 90) throw new RangeError('latitude must be a number from -90 to 90');
  if (!Number.isFinite(lon) || lon < -180 || lon > 180) throw new RangeError('longitude must be a number from -180 to 180');
}

/**
 * The part of [start, end) during which bees fly, in hours. Each solar day's window is
 * clipped to the span and overlapping windows are merged first: in high-latitude summers
 * one day's window runs into the next, and no hour may count twice.
 */
export function hoursDuringBeeFlight(start: Date, end: Date, lat: number, lon: number, settings: BeeFlightSettings = defaultBeeFlight): number {
  assertPlace(lat, lon);
  if (!Number.isFinite(start.getTime()) || !Number.isFinite(end.getTime())) throw new RangeError('start and end must be valid times');
  const clipped: Array<[number, number]> = [];
  // Solar noon is near 12:00 - lon/15 h UTC; step one day at a time from the day before.
  const firstNoon = Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), start.getUTCDate(), 12) - (lon / 15) * HOUR_MS - DAY_MS;
  for (let noon = firstNoon; noon < end.getTime() + DAY_MS; noon += DAY_MS) {
    const window = beeFlightWindow(new Date(noon), lat, lon, settings);
    if (!window) continue;
    const from = Math.max(window.from.getTime(), start.getTime());
    const to = Math.min(window.to.getTime(), end.getTime());
    if (to > from) clipped.push([from, to]);
  }
  clipped.sort((a, b) => a[0] - b[0]);
  let overlapMs = 0;
  let reached = -Infinity;
  for (const [from, to] of clipped) {
    const begin = Math.max(from, reached);
    if (to > begin) overlapMs += to - begin;
    reached = Math.max(reached, to);
  }
  return overlapMs / HOUR_MS;
}

export function overlapsBeeFlight(start: Date, end: Date, lat: number, lon: number, settings: BeeFlightSettings = defaultBeeFlight): boolean {
  return hoursDuringBeeFlight(start, end, lat, lon, settings) > 0;
}

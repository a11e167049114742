// Builders for weather stations, daily temperatures and forecast lows, and a synthetic but
// plausible spring for tests and the demo (deterministic: no randomness).
import { QueryTypes, type Sequelize } from 'sequelize';
import { builderSequelize } from './builder-database.js';

function db(): Sequelize {
  const sequelize = builderSequelize();
  if (!sequelize) throw new Error('models are not initialised: start the test app first');
  return sequelize;
}

type Id = { id: string };

export async function buildStation(attrs: { farm: Id; name?: string; lon?: number; lat?: number; timeZone?: string }) {
  const [row] = await db().query<{ id: string }>(
    `INSERT INTO weather_stations (farm_id, name, location, time_zone) VALUES (:farmId, :name, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326), :timeZone) RETURNING id`,
    {
      replacements: { farmId: attrs.farm.id, name: attrs.name ?? `Station ${Math.random().toString(36).slice(2, 7)}`, lon: attrs.lon ?? -119.9, lat: attrs.lat ?? 44.9, timeZone: attrs.timeZone ?? 'America/Los_Angeles' },
      type: QueryTypes.SELECT,
    },
  );
  return { id: row.id, name: attrs.name ?? '' };
}

export interface DayReading { day: string; tminC: number; tmaxC: number }

export async function buildDailyTemperatures(attrs: { station: Id; days: DayReading[] }) {
  if (!attrs.days.length) return;
  const values = attrs.days.map((_, i) => `(:station, :day${i}::date, :tmin${i}, :tmax${i}, 'upload')`).join(', ');
  const replacements: Record<string, unknown> = { station: attrs.station.id };
  attrs.days.forEach((d, i) => Object.assign(replacements, { [`day${i}`]: d.day, [`tmin${i}`]: d.tminC, [`tmax${i}`]: d.tmaxC }));
  await db().query(
    `INSERT INTO daily_temperatures (station_id, day, tmin_c, tmax_c, source) VALUES ${values}
     ON CONFLICT (station_id, day) DO UPDATE SET tmin_c = EXCLUDED.tmin_c, tmax_c = EXCLUDED.tmax_c`,
    { replacements },
  );
}

export async function buildForecastLow(attrs: { station: Id; day: string; lowC: number }) {
  await db().query(
    `INSERT INTO forecast_lows (station_id, day, low_c) VALUES (:station, :day, :lowC) ON CONFLICT (station_id, day) DO UPDATE SET low_c = EXCLUDED.low_c`,
    { replacements: { station: attrs.station.id, day: attrs.day, lowC: attrs.lowC } },
  );
}

const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * A synthetic spring: the daily mean warms linearly from `meanFromC` to `meanToC` over
 * `days` days, with a day-to-day wobble of a few degrees and a diurnal range near 12 °C.
 */
export function syntheticSpring(attrs: { from: Date; days: number; meanFromC: number; meanToC: number; seed?: number }): DayReading[] {
  const seed = attrs.seed ?? 1;
  return Array.from({ length: attrs.days }, (_, i) => {
    const trend = attrs.meanFromC + ((attrs.meanToC - attrs.meanFromC) * i) / Math.max(1, attrs.days - 1);
    const wobble = 2.5 * Math.sin((i + seed) * 0.9) + 1.5 * Math.sin((i + 2 * seed) * 0.37);
    const range = 11 + 3 * Math.sin((i + seed) * 0.53);
    const mean = trend + wobble;
    const day = new Date(Date.UTC(attrs.from.getUTCFullYear(), attrs.from.getUTCMonth(), attrs.from.getUTCDate() + i));
    return { day: isoDay(day), tminC: Math.round((mean - range / 2) * 10) / 10, tmaxC: Math.round((mean + range / 2) * 10) / 10 };
  });
}

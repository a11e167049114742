// A farm's weather stations and their daily temperatures and forecast lows, scoped to the
// user's farm (another farm's station is "not found"). Temperatures are stored in °C.
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type {
  DailyTemperatureDto, ForecastLowDto, StationDto, UploadResult, stationBody, stationPatch, TemperatureUnit,
} from '../../../../shared/schemas/weather.js';
import { TEMPERATURE_BOUNDS_C } from '../../../../shared/schemas/weather.js';
import type { GeoPoint } from '../../../../shared/schemas/common.js';
import { fahrenheitToCelsius } from '../../../../shared/domain/units.js';
import { badRequest, conflict, notFound } from '../../errors/http-errors.js';
import { lineErrorFields, parseForecastLowCsv, parseTemperatureCsv } from './temperature-csv.js';

interface StationRow {
  id: string; farm_id: string; name: string; location_json: GeoPoint; time_zone: string; days: string;
  first_day: string | null; last_day: string | null; created_at: Date;
}

const stationSelect = `
  SELECT s.id, s.farm_id, s.name, ST_AsGeoJSON(s.location)::json AS location_json, s.time_zone, s.created_at,
    (SELECT count(*) FROM daily_temperatures t WHERE t.station_id = s.id) AS days,
    (SELECT to_char(min(day), 'YYYY-MM-DD') FROM daily_temperatures t WHERE t.station_id = s.id) AS first_day,
    (SELECT to_char(max(day), 'YYYY-MM-DD') FROM daily_temperatures t WHERE t.station_id = s.id) AS last_day
  FROM weather_stations s`;

const toDto = (r: StationRow): StationDto => ({
  id: r.id, farmId: r.farm_id, name: r.name, location: r.location_json, timeZone: r.time_zone, days: Number(r.days),
  firstDay: r.first_day, lastDay: r.last_day, createdAt: new Date(r.created_at).toISOString(),
});

const toC = (value: number, unit: TemperatureUnit) => (unit === 'C' ? value : fahrenheitToCelsius(value));

function checkBounds(field: string, c: number) {
  if (c < TEMPERATURE_BOUNDS_C.min || c > TEMPERATURE_BOUNDS_C.max) {
    throw badRequest(`The ${field} is out of range.`, { [field]: 'is out of range (-60 to 60 °C, -76 to 140 °F)' });
  }
}

export function createStationsService(ctx: AppContext) {
  const { sequelize } = ctx;
  const nameTaken = () => conflict('Your farm already has a station with that name.', { name: 'is already used by another station' });

  async function get(farmId: string, id: string): Promise<StationDto> {
    const [row] = await sequelize.query<StationRow>(`${stationSelect} WHERE s.id = :id AND s.farm_id = :farmId`, {
      replacements: { id, farmId }, type: QueryTypes.SELECT,
    });
    if (!row) throw notFound('That weather station');
    return toDto(row);
  }

  async function upsertDays(stationId: string, userId: string, source: 'upload' | 'manual', days: Array<{ day: string; tminC: number; tmaxC: number }>, transaction?: Transaction) {
    let replaced = 0;
    for (const d of days) {
      const [row] = await sequelize.query<{ inserted: boolean }>(
        `INSERT INTO daily_temperatures (station_id, day, tmin_c, tmax_c, source, entered_by) VALUES (:stationId, :day, :tmin, :tmax, :source, :userId)
         ON CONFLICT (station_id, day) DO UPDATE SET tmin_c = EXCLUDED.tmin_c, tmax_c = EXCLUDED.tmax_c, source = EXCLUDED.source,
           entered_by = EXCLUDED.entered_by, updated_at = now()
         RETURNING (xmax = 0) AS inserted`,
        { replacements: { stationId, day: d.day, tmin: d.tminC, tmax: d.tmaxC, source, userId }, type: QueryTypes.SELECT, transaction },
      );
      if (!row.inserted) replaced++;
    }
    return replaced;
  }

  return {
    get,

    async list(farmId: string): Promise<StationDto[]> {
      const rows = await sequelize.query<StationRow>(`${stationSelect} WHERE s.farm_id = :farmId ORDER BY s.name`, { replacements: { farmId }, type: QueryTypes.SELECT });
      return rows.map(toDto);
    },

    async create(farmId: string, body: z.output<typeof stationBody>): Promise<StationDto> {
      try {
        const [row] = await sequelize.query<{ id: string }>(
          `INSERT INTO weather_stations (farm_id, name, location, time_zone) VALUES (:farmId, :name, ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326), :timeZone) RETURNING id`,
          { replacements: { farmId, name: body.name, location: JSON.stringify(body.location), timeZone: body.timeZone }, type: QueryTypes.SELECT },
        );
        return get(farmId, row.id);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
    },

    async update(farmId: string, id: string, patch: z.output<typeof stationPatch>): Promise<StationDto> {
      const current = await get(farmId, id);
      try {
        await sequelize.query(
          `UPDATE weather_stations SET name = :name, location = ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326), time_zone = :timeZone, updated_at = now()
           WHERE id = :id AND farm_id = :farmId`,
          { replacements: { id, farmId, name: patch.name ?? current.name, location: JSON.stringify(patch.location ?? current.location), timeZone: patch.timeZone ?? current.timeZone } },
        );
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
      return get(farmId, id);
    },

    async temperatures(farmId: string, id: string, range: { from?: string; to?: string }): Promise<DailyTemperatureDto[]> {
      await get(farmId, id);
      const rows = await sequelize.query<{ day: string; tmin_c: number; tmax_c: number; source: 'upload' | 'manual' }>(
        `SELECT to_char(day, 'YYYY-MM-DD') AS day, tmin_c, tmax_c, source FROM daily_temperatures
         WHERE station_id = :id AND (:from::date IS NULL OR day >= :from::date) AND (:to::date IS NULL OR day <= :to::date) ORDER BY day`,
        { replacements: { id, from: range.from ?? null, to: range.to ?? null }, type: QueryTypes.SELECT },
      );
      return rows.map((r) => ({ day: r.day, tminC: r.tmin_c, tmaxC: r.tmax_c, source: r.source }));
    },

    async enterDay(farmId: string, userId: string, id: string, day: string, body: { tmin: number; tmax: number; unit: TemperatureUnit }): Promise<DailyTemperatureDto> {
      await get(farmId, id);
      const tminC = toC(body.tmin, body.unit);
      const tmaxC = toC(body.tmax, body.unit);
      checkBounds('tmin', tminC);
      checkBounds('tmax', tmaxC);
      await upsertDays(id, userId, 'manual', [{ day, tminC, tmaxC }]);
      return { day, tminC, tmaxC, source: 'manual' };
    },

    /** Saves an uploaded CSV: nothing when any line is bad, unless the user accepted skipping those lines. */
    async upload(farmId: string, userId: string, id: string, file: Buffer, options: { unit: TemperatureUnit; skipBadLines: boolean }): Promise<UploadResult> {
      await get(farmId, id);
      const { days, errors } = parseTemperatureCsv(file, options.unit);
      if (errors.length && !options.skipBadLines) {
        const lines = new Set(errors.map((e) => e.line)).size;
        throw badRequest(`${lines} line${lines === 1 ? ' has' : 's have'} errors, so nothing was saved. Correct the file, or upload it again accepting that those lines are skipped.`, lineErrorFields(errors));
      }
      if (!days.length) throw badRequest('No line of the file could be saved.', { file: 'has no valid temperature lines' });
      const replaced = await sequelize.transaction((transaction) => upsertDays(id, userId, 'upload', days, transaction));
      return { saved: days.length, replaced, skipped: errors };
    },

    /** Forecast lows from a CSV (date, low), with the same all-or-nothing rule as temperatures. */
    async uploadForecastLows(farmId: string, userId: string, id: string, file: Buffer, options: { unit: TemperatureUnit; skipBadLines: boolean }): Promise<UploadResult> {
      await get(farmId, id);
      const { days, errors } = parseForecastLowCsv(file, options.unit);
      if (errors.length && !options.skipBadLines) {
        const lines = new Set(errors.map((e) => e.line)).size;
        throw badRequest(`${lines} line${lines === 1 ? ' has' : 's have'} errors, so nothing was saved. Correct the file, or upload it again accepting that those lines are skipped.`, lineErrorFields(errors));
      }
      if (!days.length) throw badRequest('No line of the file could be saved.', { file: 'has no valid forecast lines' });
      const replaced = await sequelize.transaction(async (transaction) => {
        let count = 0;
        for (const d of days) {
          const [row] = await sequelize.query<{ inserted: boolean }>(
            `INSERT INTO forecast_lows (station_id, day, low_c, entered_by) VALUES (:id, :day, :lowC, :userId)
             ON CONFLICT (station_id, day) DO UPDATE SET low_c = EXCLUDED.low_c, entered_by = EXCLUDED.entered_by, updated_at = now()
             RETURNING (xmax = 0) AS inserted`,
            { replacements: { id, day: d.day, lowC: d.lowC, userId }, type: QueryTypes.SELECT, transaction },
          );
          if (!row.inserted) count++;
        }
        return count;
      });
      return { saved: days.length, replaced, skipped: errors };
    },

    async forecastLows(farmId: string, id: string, fromDay?: string): Promise<ForecastLowDto[]> {
      await get(farmId, id);
      const rows = await sequelize.query<{ day: string; low_c: number }>(
        `SELECT to_char(day, 'YYYY-MM-DD') AS day, low_c FROM forecast_lows WHERE station_id = :id AND (:from::date IS NULL OR day >= :from::date) ORDER BY day`,
        { replacements: { id, from: fromDay ?? null }, type: QueryTypes.SELECT },
      );
      return rows.map((r) => ({ day: r.day, lowC: r.low_c }));
    },

    async enterForecastLow(farmId: string, userId: string, id: string, day: string, body: { low: number; unit: TemperatureUnit }): Promise<ForecastLowDto> {
      await get(farmId, id);
      const lowC = toC(body.low, body.unit);
      checkBounds('low', lowC);
      await sequelize.query(
        `INSERT INTO forecast_lows (station_id, day, low_c, entered_by) VALUES (:id, :day, :lowC, :userId)
         ON CONFLICT (station_id, day) DO UPDATE SET low_c = EXCLUDED.low_c, entered_by = EXCLUDED.entered_by, updated_at = now()`,
        { replacements: { id, day, lowC, userId } },
      );
      return { day, lowC };
    },
  };
}

export type StationsService = ReturnType<typeof createStationsService>;

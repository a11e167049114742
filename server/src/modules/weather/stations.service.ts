// A farm's weather stations and their daily temperatures and forecast lows, scoped to the
// user's farm (another farm's station is "not found"). Temperatures are stored in °C.
import { Op, UniqueConstraintError, cast, col, fn, type Transaction } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type {
  DailyTemperatureDto, ForecastLowDto, StationDto, UploadResult, stationBody, stationPatch, TemperatureUnit,
} from '../../../../shared/schemas/weather.js';
import { TEMPERATURE_BOUNDS_C } from '../../../../shared/schemas/weather.js';
import { fahrenheitToCelsius } from '../../../../shared/domain/units.js';
import type { WeatherStation } from '../../db/models/weather-station.model.js';
import { plainGeoJson } from '../../db/geojson.js';
import { badRequest, conflict, notFound } from '../../errors/http-errors.js';
import { lineErrorFields, parseForecastLowCsv, parseTemperatureCsv } from './temperature-csv.js';

interface StationDays { days: number; firstDay: string | null; lastDay: string | null }

const toDto = (s: WeatherStation, d: StationDays | undefined): StationDto => ({
  id: s.id, farmId: s.farmId, name: s.name, location: plainGeoJson(s.location), timeZone: s.timeZone, days: d?.days ?? 0,
  firstDay: d?.firstDay ?? null, lastDay: d?.lastDay ?? null, createdAt: s.createdAt.toISOString(),
});

const toC = (value: number, unit: TemperatureUnit) => (unit === 'C' ? value : fahrenheitToCelsius(value));

function checkBounds(field: string, c: number) {
  if (c < TEMPERATURE_BOUNDS_C.min || c > TEMPERATURE_BOUNDS_C.max) {
    throw badRequest(`The ${field} is out of range.`, { [field]: 'is out of range (-60 to 60 °C, -76 to 140 °F)' });
  }
}

export function createStationsService(ctx: AppContext) {
  const { sequelize } = ctx;
  const { WeatherStation, DailyTemperature, ForecastLow } = ctx.models;
  const stationsOf = (farmId: string) => WeatherStation.scope({ method: ['ofFarm', farmId] });
  const nameTaken = () => conflict('Your farm already has a station with that name.', { name: 'is already used by another station' });

  /** How many days each station has recorded, and its first and last. */
  async function daysOf(stationIds: string[]): Promise<Map<string, StationDays>> {
    if (!stationIds.length) return new Map();
    const rows = (await DailyTemperature.findAll({
      attributes: ['stationId', [cast(fn('count', col('day')), 'integer'), 'days'], [fn('min', col('day')), 'firstDay'], [fn('max', col('day')), 'lastDay']],
      where: { stationId: stationIds },
      group: ['stationId'],
      raw: true,
    })) as unknown as Array<StationDays & { stationId: string }>;
    return new Map(rows.map((r) => [r.stationId, r]));
  }

  async function find(farmId: string, id: string): Promise<WeatherStation> {
    const station = await stationsOf(farmId).findOne({ where: { id } });
    if (!station) throw notFound('That weather station');
    return station;
  }

  async function get(farmId: string, id: string): Promise<StationDto> {
    const station = await find(farmId, id);
    return toDto(station, (await daysOf([id])).get(id));
  }

  /** Stores days (a later value for a day replaces the earlier one); gives how many replaced stored days. */
  async function upsertDays(stationId: string, userId: string, source: 'upload' | 'manual', days: Array<{ day: string; tminC: number; tmaxC: number }>, transaction?: Transaction) {
    const stored = await DailyTemperature.count({ where: { stationId, day: [...new Set(days.map((d) => d.day))] }, transaction });
    await DailyTemperature.bulkCreate(
      days.map((d) => ({ stationId, day: d.day, tminC: d.tminC, tmaxC: d.tmaxC, source, enteredBy: userId })),
      { updateOnDuplicate: ['tminC', 'tmaxC', 'source', 'enteredBy', 'updatedAt'], conflictAttributes: ['stationId', 'day'], transaction },
    );
    return stored;
  }

  async function upsertForecastLows(stationId: string, userId: string, lows: Array<{ day: string; lowC: number }>, transaction?: Transaction) {
    const stored = await ForecastLow.count({ where: { stationId, day: [...new Set(lows.map((d) => d.day))] }, transaction });
    await ForecastLow.bulkCreate(
      lows.map((d) => ({ stationId, day: d.day, lowC: d.lowC, enteredBy: userId })),
      { updateOnDuplicate: ['lowC', 'enteredBy', 'updatedAt'], conflictAttributes: ['stationId', 'day'], transaction },
    );
    return stored;
  }

  return {
    get,

    async list(farmId: string): Promise<StationDto[]> {
      const stations = await stationsOf(farmId).findAll({ order: [['name', 'ASC']] });
      const days = await daysOf(stations.map((s) => s.id));
      return stations.map((s) => toDto(s, days.get(s.id)));
    },

    async create(farmId: string, body: z.output<typeof stationBody>): Promise<StationDto> {
      try {
        const station = await WeatherStation.create({ farmId, name: body.name, location: body.location, timeZone: body.timeZone });
        return get(farmId, station.id);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
    },

    async update(farmId: string, id: string, patch: z.output<typeof stationPatch>): Promise<StationDto> {
      const station = await find(farmId, id);
      try {
        await station.update({ name: patch.name ?? station.name, location: patch.location ?? station.location, timeZone: patch.timeZone ?? station.timeZone });
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
      return get(farmId, id);
    },

    async temperatures(farmId: string, id: string, range: { from?: string; to?: string }): Promise<DailyTemperatureDto[]> {
      await get(farmId, id);
      const day = { ...(range.from ? { [Op.gte]: range.from } : {}), ...(range.to ? { [Op.lte]: range.to } : {}) };
      const rows = await DailyTemperature.findAll({ where: { stationId: id, ...(range.from || range.to ? { day } : {}) }, order: [['day', 'ASC']] });
      return rows.map((r) => ({ day: r.day, tminC: r.tminC, tmaxC: r.tmaxC, source: r.source }));
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
      const replaced = await sequelize.transaction((transaction) => upsertForecastLows(id, userId, days, transaction));
      return { saved: days.length, replaced, skipped: errors };
    },

    async forecastLows(farmId: string, id: string, fromDay?: string): Promise<ForecastLowDto[]> {
      await get(farmId, id);
      const rows = await ForecastLow.findAll({ where: { stationId: id, ...(fromDay ? { day: { [Op.gte]: fromDay } } : {}) }, order: [['day', 'ASC']] });
      return rows.map((r) => ({ day: r.day, lowC: r.lowC }));
    },

    async enterForecastLow(farmId: string, userId: string, id: string, day: string, body: { low: number; unit: TemperatureUnit }): Promise<ForecastLowDto> {
      await get(farmId, id);
      const lowC = toC(body.low, body.unit);
      checkBounds('low', lowC);
      await upsertForecastLows(id, userId, [{ day, lowC }]);
      return { day, lowC };
    },
  };
}

export type StationsService = ReturnType<typeof createStationsService>;

// Reads an uploaded CSV of daily minimum and maximum temperatures (columns date, min,
// max in any order; header names such as tmin/minimum are accepted), or of forecast lows
// (date, low), and reports every bad line: bad date, not a number, value out of range,
// minimum above maximum, duplicate day.
import { parse } from 'csv-parse/sync';
import { DateTime } from 'luxon';
import { fahrenheitToCelsius } from '../../../../shared/domain/units.js';
import { TEMPERATURE_BOUNDS_C, type TemperatureUnit, type UploadLineError } from '../../../../shared/schemas/weather.js';
import { badRequest } from '../../errors/http-errors.js';
import { inTradeYears, tradeYears } from '../../../../shared/schemas/common.js';

export interface ParsedDay {
  line: number;
  day: string;
  tminC: number;
  tmaxC: number;
}

const headerNames = {
  date: ['date', 'day'],
  tmin: ['tmin', 'min', 'minimum', 'low', 'tmin_f', 'tmin_c', 'min_temp'],
  tmax: ['tmax', 'max', 'maximum', 'high', 'tmax_f', 'tmax_c', 'max_temp'],
  low: ['low', 'forecast_low', 'min', 'minimum', 'tmin'],
} as const;

function boundsText(unit: TemperatureUnit) {
  return unit === 'C' ? `${TEMPERATURE_BOUNDS_C.min} to ${TEMPERATURE_BOUNDS_C.max} °C` : '-76 to 140 °F';
}

function readRows(content: Buffer): string[][] {
  try {
    return parse(content, { skip_empty_lines: true, trim: true, bom: true, relax_column_count: true }) as string[][];
  } catch (err) {
    throw badRequest(`The file could not be read as CSV: ${(err as Error).message}`, { file: 'is not a readable CSV file' });
  }
}

function columnsOf<K extends keyof typeof headerNames>(rows: string[][], wanted: readonly K[]): Record<K, number> {
  if (rows.length < 2) throw badRequest('The file holds no lines under its header.', { file: 'holds no lines under its header' });
  const header = rows[0].map((h) => h.toLowerCase().replace(/[^a-z_]/g, ''));
  const columns = Object.fromEntries(wanted.map((k) => [k, header.findIndex((h) => (headerNames[k] as readonly string[]).includes(h))])) as Record<K, number>;
  const missing = wanted.filter((k) => columns[k] < 0);
  if (missing.length) {
    throw badRequest(`The header line needs columns ${wanted.join(', ')} (missing: ${missing.join(', ')}).`, { file: `header lacks ${missing.join(', ')}` });
  }
  return columns;
}

export interface ParsedLow { line: number; day: string; lowC: number }

/** Forecast lows: columns date and low. */
export function parseForecastLowCsv(content: Buffer, unit: TemperatureUnit): { days: ParsedLow[]; errors: UploadLineError[] } {
  const rows = readRows(content);
  const columns = columnsOf(rows, ['date', 'low'] as const);
  const days: ParsedLow[] = [];
  const errors: UploadLineError[] = [];
  const seen = new Map<string, number>();
  rows.slice(1).forEach((cells, index) => {
    const line = index + 2;
    const lineErrors: UploadLineError[] = [];
    const day = checkDate(cells[columns.date] ?? '', line, seen, lineErrors);
    const lowC = checkReading(cells[columns.low] ?? '', 'low', unit, line, lineErrors);
    if (lineErrors.length) errors.push(...lineErrors);
    else days.push({ line, day: day!, lowC: lowC! });
  });
  return { days, errors };
}

function checkDate(text: string, line: number, seen: Map<string, number>, out: UploadLineError[]): string | null {
  const date = /^\d{4}-\d{2}-\d{2}$/.test(text) ? DateTime.fromISO(text, { zone: 'UTC' }) : null;
  if (!date?.isValid) {
    out.push({ line, field: 'date', message: `"${text}" is not a date (YYYY-MM-DD)` });
    return null;
  }
  if (!inTradeYears(text)) {
    out.push({ line, field: 'date', message: `${text} is not between ${tradeYears.from} and ${tradeYears.to}` });
    return null;
  }
  const firstLine = seen.get(text);
  if (firstLine) {
    out.push({ line, field: 'date', message: `duplicate day ${text} (also on line ${firstLine})` });
    return null;
  }
  seen.set(text, line);
  return text;
}

function checkReading(text: string, field: UploadLineError['field'], unit: TemperatureUnit, line: number, out: UploadLineError[]): number | null {
  const value = text === '' ? NaN : Number(text);
  if (!Number.isFinite(value)) {
    out.push({ line, field, message: `"${text}" is not a number` });
    return null;
  }
  const c = unit === 'C' ? value : fahrenheitToCelsius(value);
  if (c < TEMPERATURE_BOUNDS_C.min || c > TEMPERATURE_BOUNDS_C.max) {
    out.push({ line, field, message: `${value} is out of range (${boundsText(unit)})` });
    return null;
  }
  return c;
}

export function parseTemperatureCsv(content: Buffer, unit: TemperatureUnit): { days: ParsedDay[]; errors: UploadLineError[] } {
  const rows = readRows(content);
  const columns = columnsOf(rows, ['date', 'tmin', 'tmax'] as const);
  const days: ParsedDay[] = [];
  const errors: UploadLineError[] = [];
  const seen = new Map<string, number>();
  rows.slice(1).forEach((cells, index) => {
    const line = index + 2;
    const lineErrors: UploadLineError[] = [];
    const day = checkDate(cells[columns.date] ?? '', line, seen, lineErrors);
    const tminC = checkReading(cells[columns.tmin] ?? '', 'tmin', unit, line, lineErrors);
    const tmaxC = checkReading(cells[columns.tmax] ?? '', 'tmax', unit, line, lineErrors);
    if (tminC !== null && tmaxC !== null && tminC > tmaxC) lineErrors.push({ line, field: 'tmin', message: 'the minimum is above the maximum' });
    if (lineErrors.length) errors.push(...lineErrors);
    else days.push({ line, day: day!, tminC: tminC!, tmaxC: tmaxC! });
  });
  return { days, errors };
}

/** Line errors as the error body's fields, keyed lines.<line>.<field>. */
export function lineErrorFields(errors: UploadLineError[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const e of errors) fields[`lines.${e.line}.${e.field}`] ??= e.message;
  return fields;
}

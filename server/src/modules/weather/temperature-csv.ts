// Reads an uploaded CSV of daily minimum and maximum temperatures (columns date, min,
// max in any order; header names such as tmin/minimum/low are accepted) and reports every
// bad line: bad date, not a number, value out of range, minimum above maximum, duplicate day.
import { parse } from 'csv-parse/sync';
import { DateTime } from 'luxon';
import { fahrenheitToCelsius } from '../../../../shared/domain/units.js';
import { TEMPERATURE_BOUNDS_C, type TemperatureUnit, type UploadLineError } from '../../../../shared/schemas/weather.js';
import { badRequest } from '../../errors/http-errors.js';

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
} as const;

function boundsText(unit: TemperatureUnit) {
  return unit === 'C' ? `${TEMPERATURE_BOUNDS_C.min} to ${TEMPERATURE_BOUNDS_C.max} °C` : '-76 to 140 °F';
}

export function parseTemperatureCsv(content: Buffer, unit: TemperatureUnit): { days: ParsedDay[]; errors: UploadLineError[] } {
  let rows: string[][];
  try {
    rows = parse(content, { skip_empty_lines: true, trim: true, bom: true, relax_column_count: true }) as string[][];
  } catch (err) {
    throw badRequest(`The file could not be read as CSV: ${(err as Error).message}`, { file: 'is not a readable CSV file' });
  }
  if (rows.length < 2) throw badRequest('The file holds no temperature lines.', { file: 'holds no temperature lines under its header' });
  const header = rows[0].map((h) => h.toLowerCase().replace(/[^a-z_]/g, ''));
  const column = (names: readonly string[]) => header.findIndex((h) => names.includes(h));
  const columns = { date: column(headerNames.date), tmin: column(headerNames.tmin), tmax: column(headerNames.tmax) };
  const missing = Object.entries(columns).filter(([, index]) => index < 0).map(([name]) => name);
  if (missing.length) {
    throw badRequest(`The header line needs columns date, tmin and tmax (missing: ${missing.join(', ')}).`, { file: `header lacks ${missing.join(', ')}` });
  }

  const toC = (v: number) => (unit === 'C' ? v : fahrenheitToCelsius(v));
  const days: ParsedDay[] = [];
  const errors: UploadLineError[] = [];
  const seen = new Map<string, number>();
  rows.slice(1).forEach((cells, index) => {
    const line = index + 2;
    const lineErrors: UploadLineError[] = [];
    const dateText = cells[columns.date] ?? '';
    const date = /^\d{4}-\d{2}-\d{2}$/.test(dateText) ? DateTime.fromISO(dateText, { zone: 'UTC' }) : null;
    if (!date?.isValid) lineErrors.push({ line, field: 'date', message: `"${dateText}" is not a date (YYYY-MM-DD)` });
    const reading = (field: 'tmin' | 'tmax') => {
      const text = cells[columns[field]] ?? '';
      const value = text === '' ? NaN : Number(text);
      if (!Number.isFinite(value)) {
        lineErrors.push({ line, field, message: `"${text}" is not a number` });
        return null;
      }
      const c = toC(value);
      if (c < TEMPERATURE_BOUNDS_C.min || c > TEMPERATURE_BOUNDS_C.max) {
        lineErrors.push({ line, field, message: `${value} is out of range (${boundsText(unit)})` });
        return null;
      }
      return c;
    };
    const tminC = reading('tmin');
    const tmaxC = reading('tmax');
    if (tminC !== null && tmaxC !== null && tminC > tmaxC) lineErrors.push({ line, field: 'tmin', message: 'the minimum is above the maximum' });
    if (date?.isValid) {
      const firstLine = seen.get(dateText);
      if (firstLine) lineErrors.push({ line, field: 'date', message: `duplicate day ${dateText} (also on line ${firstLine})` });
      else seen.set(dateText, line);
    }
    if (lineErrors.length) errors.push(...lineErrors);
    else days.push({ line, day: dateText, tminC: tminC!, tmaxC: tmaxC! });
  });
  return { days, errors };
}

/** Line errors as the error body's fields, keyed lines.<line>.<field>. */
export function lineErrorFields(errors: UploadLineError[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const e of errors) fields[`lines.${e.line}.${e.field}`] ??= e.message;
  return fields;
}

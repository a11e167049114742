// Spray times are entered in the farm's time zone (datetime-local fields) and sent as UTC.
import { DateTime } from 'luxon';

export const toLocalInput = (iso: string, zone: string) => DateTime.fromISO(iso, { zone }).toFormat("yyyy-LL-dd'T'HH:mm");
export const fromLocalInput = (value: string, zone: string): string | null => {
  if (!value) return null;
  const dt = DateTime.fromISO(value, { zone });
  return dt.isValid ? dt.toUTC().toISO() : null;
};

// Calendar days in the farm's time zone. A day a person types (an answer deadline, a trap
// check) is a day where the farm is, not a UTC date: a Pacific evening is already the next
// day in UTC, and a UTC midnight comes seven or eight hours before the farm's.
import { DateTime } from 'luxon';

/** The calendar day (YYYY-MM-DD) a moment falls on in a time zone. */
export function localDay(at: Date, timeZone: string): string {
  const local = DateTime.fromJSDate(at, { zone: timeZone });
  if (!local.isValid) throw new RangeError(`unknown time zone: ${timeZone}`);
  return local.toISODate()!;
}

/** True once the whole of `day` is over in the time zone (a deadline "by 15 May" holds through 15 May, local). */
export function dayIsOver(day: string | null, now: Date, timeZone: string): boolean {
  return day != null && day < localDay(now, timeZone);
}

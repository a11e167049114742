// The dashboard's day and season, in the organization's time zone: the season is the
// calendar year of "today" there unless one is asked for.
import { DateTime } from 'luxon';

export interface SeasonClock {
  timeZone: string;
  season: number;
  /** YYYY-MM-DD in the time zone. */
  today: string;
  now: Date;
  /** [1 January, next 1 January) of the season in the time zone. */
  seasonFrom: Date;
  seasonTo: Date;
}

export function seasonClock(now: Date, timeZone: string, season?: number): SeasonClock {
  const local = DateTime.fromJSDate(now, { zone: timeZone });
  const year = season ?? local.year;
  const from = DateTime.fromObject({ year, month: 1, day: 1 }, { zone: timeZone });
  return {
    timeZone,
    season: year,
    today: local.toISODate()!,
    now,
    seasonFrom: from.toJSDate(),
    seasonTo: from.plus({ years: 1 }).toJSDate(),
  };
}

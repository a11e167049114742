// A station's daily temperatures over a season, in °F, with the days after the last
// observation (and any gap) estimated: from the station's own average of earlier seasons
// for that calendar day when it has such data, otherwise from a simple normal, the mean of
// the last 14 observed days held flat. Estimated days are flagged so charts can say so.
import { Op } from 'sequelize';
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { DailyTemperature } from '../../../../shared/domain/degree-days.js';
import { celsiusToFahrenheit } from '../../../../shared/domain/units.js';
import { calendarDayNormals } from './weather.queries.js';

export const SIMPLE_NORMAL_DAYS = 14;
/** Data at least this many days older than the last observation count as earlier seasons. */
const EARLIER_SEASON_GAP_DAYS = 300;

export interface SeasonTemperatures {
  days: DailyTemperature[];
  lastObserved: string | null;
  extension: null | { kind: 'station-normals' | 'simple-normal'; fromDay: string; description: string };
}

export async function loadSeasonTemperatures(ctx: AppContext, stationId: string, from: string, through: string): Promise<SeasonTemperatures> {
  const observed = (await ctx.models.DailyTemperature.findAll({
    attributes: ['day', 'tminC', 'tmaxC'],
    where: { stationId, day: { [Op.between]: [from, through] } },
    order: [['day', 'ASC']],
  })).map((t) => ({ day: t.day, tmin_c: t.tminC, tmax_c: t.tmaxC }));
  if (!observed.length) return { days: [], lastObserved: null, extension: null };
  const lastObserved = observed.at(-1)!.day;
  const byDay = new Map(observed.map((o) => [o.day, o]));

  const earlierThan = DateTime.fromISO(lastObserved, { zone: 'UTC' }).minus({ days: EARLIER_SEASON_GAP_DAYS }).toISODate()!;
  const normals = await calendarDayNormals(ctx.sequelize, stationId, earlierThan);
  const normalByMonthDay = new Map(normals.map((n) => [n.md, n]));
  const recent = observed.slice(-SIMPLE_NORMAL_DAYS);
  const simple = {
    tmin_c: recent.reduce((s, d) => s + d.tmin_c, 0) / recent.length,
    tmax_c: recent.reduce((s, d) => s + d.tmax_c, 0) / recent.length,
  };

  const days: DailyTemperature[] = [];
  let usedStationNormals = false;
  let usedSimple = false;
  let firstEstimated: string | null = null;
  const end = DateTime.fromISO(through, { zone: 'UTC' });
  for (let d = DateTime.fromISO(from, { zone: 'UTC' }); d <= end; d = d.plus({ days: 1 })) {
    const day = d.toISODate()!;
    const seen = byDay.get(day);
    if (seen) {
      days.push({ day, tmin: celsiusToFahrenheit(seen.tmin_c), tmax: celsiusToFahrenheit(seen.tmax_c) });
      continue;
    }
    if (day < observed[0].day) continue; // nothing before the first observation is guessed
    const normal = normalByMonthDay.get(day.slice(5));
    if (normal) usedStationNormals = true;
    else usedSimple = true;
    const source = normal ?? simple;
    firstEstimated ??= day;
    days.push({ day, tmin: celsiusToFahrenheit(source.tmin_c), tmax: celsiusToFahrenheit(source.tmax_c), estimated: true });
  }

  const description = usedStationNormals
    ? `After ${lastObserved}, this station's average of earlier seasons for each calendar day${usedSimple ? ` (where it has none, the mean of the last ${SIMPLE_NORMAL_DAYS} observed days)` : ''}.`
    : `After ${lastObserved}, a simple normal: the mean minimum and maximum of the last ${SIMPLE_NORMAL_DAYS} observed days, held flat (upload earlier seasons for a better estimate).`;
  return {
    days,
    lastObserved,
    extension: firstEstimated ? { kind: usedStationNormals ? 'station-normals' : 'simple-normal', fromDay: firstEstimated, description } : null,
  };
}

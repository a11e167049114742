// Chill units accumulated through winter at a station (Utah model, Richardson et al. 1974),
// with hours estimated from each day's minimum and maximum.
import { QueryTypes } from 'sequelize';
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { ChillDto } from '../../../../shared/schemas/weather.js';
import { dailyChillUnits } from '../../../../shared/domain/degree-days.js';
import { celsiusToFahrenheit } from '../../../../shared/domain/units.js';
import type { StationsService } from './stations.service.js';

export const CHILL_SOURCE = 'Utah model (Richardson, Seeley & Walker 1974; UC Fruit & Nut Research & Information Center); hours estimated from daily min/max';

export function createChillService(ctx: AppContext, stations: StationsService) {
  return {
    async chill(farmId: string, stationId: string, from?: string): Promise<ChillDto> {
      const station = await stations.get(farmId, stationId);
      const today = DateTime.fromJSDate(ctx.now(), { zone: station.timeZone });
      // Chill is counted from autumn: September 1 of this year once it has passed, else of last year.
      const start = from ?? DateTime.fromObject({ year: today.month >= 9 ? today.year : today.year - 1, month: 9, day: 1 }).toISODate()!;
      const rows = await ctx.sequelize.query<{ day: string; tmin_c: number; tmax_c: number }>(
        `SELECT to_char(day, 'YYYY-MM-DD') AS day, tmin_c, tmax_c FROM daily_temperatures WHERE station_id = :stationId AND day >= :start::date ORDER BY day`,
        { replacements: { stationId, start }, type: QueryTypes.SELECT },
      );
      let cumulative = 0;
      const series = rows.map((r) => {
        const units = dailyChillUnits(celsiusToFahrenheit(r.tmin_c), celsiusToFahrenheit(r.tmax_c));
        cumulative += units;
        return { day: r.day, units, cumulative };
      });
      return { stationId, from: start, model: 'utah', source: CHILL_SOURCE, total: cumulative, series };
    },
  };
}

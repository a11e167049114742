// Chill units accumulated through winter at a station (Utah model, Richardson et al. 1974),
// with hours estimated from each day's minimum and maximum, counted from the day after the
// fall total is most negative (searched from September 1), as the model's authors count.
import { Op } from 'sequelize';
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { ChillDto } from '../../../../shared/schemas/weather.js';
import { dailyChillUnits, utahChillFromFall, UTAH_CHILL_START_RULE } from '../../../../shared/domain/degree-days.js';
import { celsiusToFahrenheit } from '../../../../shared/domain/units.js';
import type { StationsService } from './stations.service.js';

export const CHILL_SOURCE = 'Utah model (Richardson, Seeley & Walker 1974; UC Fruit & Nut Research & Information Center); hours estimated from daily min/max';

export function createChillService(ctx: AppContext, stations: StationsService) {
  return {
    async chill(farmId: string, stationId: string, from?: string): Promise<ChillDto> {
      const station = await stations.get(farmId, stationId);
      const today = DateTime.fromJSDate(ctx.now(), { zone: station.timeZone });
      // The fall start is searched from September 1 of this year once it has passed, else of last year.
      const start = from ?? DateTime.fromObject({ year: today.month >= 9 ? today.year : today.year - 1, month: 9, day: 1 }).toISODate()!;
      const rows = await ctx.models.DailyTemperature.findAll({
        attributes: ['day', 'tminC', 'tmaxC'], where: { stationId, day: { [Op.gte]: start } }, order: [['day', 'ASC']],
      });
      const daysF = rows.map((r) => ({ day: r.day, tminF: celsiusToFahrenheit(r.tminC), tmaxF: celsiusToFahrenheit(r.tmaxC) }));
      if (from) {
        // A start the user chose: counted from that day as asked.
        let cumulative = 0;
        const series = daysF.map((d) => {
          const units = dailyChillUnits(d.tminF, d.tmaxF);
          cumulative += units;
          return { day: d.day, units, cumulative };
        });
        return { stationId, from: start, searchedFrom: start, startRule: 'Counted from the day you chose', model: 'utah', source: CHILL_SOURCE, total: cumulative, series };
      }
      const chill = utahChillFromFall(daysF, start);
      return { stationId, from: chill.from, searchedFrom: start, startRule: UTAH_CHILL_START_RULE, model: 'utah', source: CHILL_SOURCE, total: chill.total, series: chill.series };
    },
  };
}

// Weather aggregates the ORM does not say well: a station's average of earlier seasons
// per calendar day (the normals that extend a season's degree-day curve).
import type { Sequelize } from 'sequelize';
import { queryRows } from '../../db/query-rows.js';

export interface CalendarDayNormal { md: string; tmin_c: number; tmax_c: number; seasons: number }

/** Mean minimum and maximum per calendar day ('MM-DD') over the station's days before `before`. */
export function calendarDayNormals(sequelize: Sequelize, stationId: string, before: string): Promise<CalendarDayNormal[]> {
  return queryRows<CalendarDayNormal>(
    sequelize,
    `SELECT to_char(day, 'MM-DD') AS md, avg(tmin_c)::float8 AS tmin_c, avg(tmax_c)::float8 AS tmax_c,
       count(DISTINCT extract(year FROM day))::int AS seasons
     FROM daily_temperatures WHERE station_id = :stationId AND day < :before::date GROUP BY 1`,
    { replacements: { stationId, before } },
  );
}

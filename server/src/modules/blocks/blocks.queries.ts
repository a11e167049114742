// What PostGIS says about a drawn outline: whether it is a valid polygon (and why not),
// its area on the sphere in square metres (ST_Area on geography) and a point inside it.
import type { Sequelize, Transaction } from 'sequelize';
import { queryOne } from '../../db/query-rows.js';
import type { GeoPoint, GeoPolygon } from '../../../../shared/schemas/common.js';

export interface OutlineFacts { valid: boolean; reason: string; areaM2: number; pointInside: GeoPoint | null }

export async function outlineFacts(sequelize: Sequelize, outline: GeoPolygon, transaction?: Transaction): Promise<OutlineFacts> {
  const row = await queryOne<OutlineFacts>(
    sequelize,
    `SELECT ST_IsValid(g) AS valid, ST_IsValidReason(g) AS reason,
       CASE WHEN ST_IsValid(g) THEN ST_Area(g::geography) ELSE 0 END AS "areaM2",
       CASE WHEN ST_IsValid(g) THEN ST_AsGeoJSON(ST_PointOnSurface(g))::json END AS "pointInside"
     FROM (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326) AS g) s`,
    { replacements: { outline: JSON.stringify(outline) }, transaction },
  );
  return row!;
}

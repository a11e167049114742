// PostGIS reads for spray plans that the models cannot say: each sprayed block's outline as
// GeoJSON with a point to label it, and the farm's buffer around a plan's blocks for the map.
import type { Sequelize, Transaction } from 'sequelize';
import { queryOne, queryRows } from '../../db/query-rows.js';
import type { SprayDto } from '../../../../shared/schemas/sprays.js';

export async function blocksOfSprays(sequelize: Sequelize, sprayIds: string[], transaction?: Transaction): Promise<Map<string, SprayDto['blocks']>> {
  const rows = await queryRows<SprayDto['blocks'][number] & { spray_plan_id: string }>(
    sequelize,
    `SELECT sb.spray_plan_id, b.id, b.name, ST_AsGeoJSON(b.outline)::json AS outline,
       ST_X(coalesce(b.location, ST_Centroid(b.outline))) AS lon, ST_Y(coalesce(b.location, ST_Centroid(b.outline))) AS lat
     FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id
     WHERE sb.spray_plan_id = ANY($sprayIds::uuid[]) ORDER BY b.name`,
    { bind: { sprayIds }, transaction },
  );
  const bySpray = new Map<string, SprayDto['blocks']>();
  for (const { spray_plan_id, ...block } of rows) bySpray.set(spray_plan_id, [...(bySpray.get(spray_plan_id) ?? []), block]);
  return bySpray;
}

export async function bufferArea(sequelize: Sequelize, sprayId: string, transaction?: Transaction): Promise<string | null> {
  const row = await queryOne<{ buffer: string | null }>(
    sequelize,
    `SELECT ST_AsGeoJSON(ST_Union(ST_Buffer(coalesce(b.outline, b.location)::geography, o.spray_buffer_m)::geometry), 6) AS buffer
     FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id JOIN organizations o ON o.id = b.farm_id WHERE sb.spray_plan_id = $sprayId`,
    { bind: { sprayId }, transaction },
  );
  return row?.buffer ?? null;
}

// What PostGIS says about a drawn outline: whether it is a valid polygon (and why not),
// its area on the sphere in square metres (ST_Area on geography) and a point inside it.
// And the farm's block list, asked for on most pages: one prepared statement (planned once
// per connection) with each block's weather station name and current bloom window, the
// outline and location written as GeoJSON by PostGIS.
import type { Sequelize, Transaction } from 'sequelize';
import { prepareStatement, queryOne, queryPrepared } from '../../db/query-rows.js';
import type { GeoPoint, GeoPolygon } from '../../../../shared/schemas/common.js';
import type { BlockFields, BloomWindowFields } from './block-dto.js';

/** A block as the list reads it, with its current bloom window's columns (null without one). */
interface BlockListRow extends Omit<BlockFields, 'weatherStation'> {
  weatherStationName: string | null;
  bwId: string | null; bwSeason: number; bwBloomStart: string; bwFullBloom: string | null; bwPetalFall: string;
  bwConfidenceNote: string | null; bwRevisedBy: string | null; bwReviserName: string | null; bwCreatedAt: Date;
}

const blockListStatement = prepareStatement('block-list', `
  SELECT b.id, b.farm_id AS "farmId", b.name, b.crop, b.variety, b.pollinizer_variety AS "pollinizerVariety",
    b.year_planted AS "yearPlanted", b.trees_per_acre AS "treesPerAcre", b.notes,
    ST_AsGeoJSON(b.outline, 15)::json AS outline, ST_AsGeoJSON(b.location, 15)::json AS location,
    b.entered_acres AS "enteredAcres", b.area_m2 AS "areaM2", b.colonies_per_acre AS "coloniesPerAcre",
    b.weather_station_id AS "weatherStationId", b.degree_day_start::text AS "degreeDayStart", b.created_at AS "createdAt", b.updated_at AS "updatedAt",
    ws.name AS "weatherStationName",
    bw.id AS "bwId", bw.season AS "bwSeason", bw.bloom_start::text AS "bwBloomStart", bw.full_bloom::text AS "bwFullBloom",
    bw.petal_fall::text AS "bwPetalFall", bw.confidence_note AS "bwConfidenceNote", bw.revised_by AS "bwRevisedBy",
    bw.reviser_name AS "bwReviserName", bw.created_at AS "bwCreatedAt"
  FROM blocks b
  LEFT JOIN weather_stations ws ON ws.id = b.weather_station_id
  LEFT JOIN LATERAL (
    SELECT w.*, u.name AS reviser_name FROM bloom_windows w LEFT JOIN users u ON u.id = w.revised_by
    WHERE w.block_id = b.id ORDER BY w.season DESC, w.created_at DESC, w.id DESC LIMIT 1
  ) bw ON true
  WHERE b.farm_id = $farmId::uuid
  ORDER BY b.name`);

/** The farm's blocks by name, each with its station's name and current bloom window (the latest revision of its latest season). */
export async function selectBlockList(sequelize: Sequelize, farmId: string): Promise<Array<{ block: BlockFields; window: BloomWindowFields | null }>> {
  const rows = await queryPrepared<BlockListRow>(sequelize, blockListStatement, { farmId });
  return rows.map(({ weatherStationName, bwId, bwSeason, bwBloomStart, bwFullBloom, bwPetalFall, bwConfidenceNote, bwRevisedBy, bwReviserName, bwCreatedAt, ...block }) => ({
    block: { ...block, weatherStation: weatherStationName === null ? null : { name: weatherStationName } },
    window: bwId === null ? null : {
      id: bwId, blockId: block.id, season: bwSeason, bloomStart: bwBloomStart, fullBloom: bwFullBloom, petalFall: bwPetalFall,
      confidenceNote: bwConfidenceNote, revisedBy: bwRevisedBy, reviser: bwRevisedBy === null ? null : { name: bwReviserName ?? '' }, createdAt: bwCreatedAt,
    },
  }));
}

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

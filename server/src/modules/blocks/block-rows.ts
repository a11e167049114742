// Reading blocks from the database (with geometry as GeoJSON and the current bloom
// window) and turning rows into the API's BlockDto.
import { QueryTypes, type Sequelize } from 'sequelize';
import type { BlockDto, BloomWindowDto } from '../../../../shared/schemas/blocks.js';
import type { CropKey } from '../../../../shared/domain/crops.js';
import { cropInfo } from '../../../../shared/domain/crops.js';
import { coloniesNeeded, stockingAdvice } from '../../../../shared/domain/stocking.js';
import { squareMetresToAcres } from '../../../../shared/domain/units.js';
import type { GeoPoint, GeoPolygon } from '../../../../shared/schemas/common.js';

export interface BloomWindowRow {
  id: string; block_id: string; season: number; bloom_start: string; full_bloom: string | null; petal_fall: string;
  confidence_note: string | null; revised_by: string | null; revised_by_name: string | null; created_at: Date;
}

interface BlockRow {
  id: string; farm_id: string; name: string; crop: string; variety: string | null; pollinizer_variety: string | null;
  year_planted: number | null; trees_per_acre: number | null; notes: string | null; outline_json: GeoPolygon | null;
  location_json: GeoPoint | null; entered_acres: number | null; area_m2: number; colonies_per_acre: number;
  weather_station_id: string | null; station_name: string | null; degree_day_start: string | null;
  created_at: Date; updated_at: Date; bloom: BloomWindowRow | null;
}

const blockSelect = `
  SELECT b.id, b.farm_id, b.name, b.crop, b.variety, b.pollinizer_variety, b.year_planted, b.trees_per_acre, b.notes,
    ST_AsGeoJSON(b.outline)::json AS outline_json, ST_AsGeoJSON(b.location)::json AS location_json,
    b.entered_acres, b.area_m2, b.colonies_per_acre, b.weather_station_id, ws.name AS station_name,
    to_char(b.degree_day_start, 'YYYY-MM-DD') AS degree_day_start, b.created_at, b.updated_at,
    (SELECT row_to_json(w) FROM (
       SELECT cw.id, cw.block_id, cw.season, to_char(cw.bloom_start, 'YYYY-MM-DD') AS bloom_start,
         to_char(cw.full_bloom, 'YYYY-MM-DD') AS full_bloom, to_char(cw.petal_fall, 'YYYY-MM-DD') AS petal_fall,
         cw.confidence_note, cw.revised_by, u.name AS revised_by_name, cw.created_at
       FROM current_bloom_windows cw LEFT JOIN users u ON u.id = cw.revised_by
       WHERE cw.block_id = b.id ORDER BY cw.season DESC LIMIT 1) w) AS bloom
  FROM blocks b LEFT JOIN weather_stations ws ON ws.id = b.weather_station_id`;

export function toBloomWindowDto(row: BloomWindowRow): BloomWindowDto {
  return {
    id: row.id, blockId: row.block_id, season: row.season, bloomStart: row.bloom_start, fullBloom: row.full_bloom,
    petalFall: row.petal_fall, confidenceNote: row.confidence_note,
    revisedBy: row.revised_by ? { id: row.revised_by, name: row.revised_by_name ?? '' } : null,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

function toBlockDto(row: BlockRow): BlockDto {
  const acres = squareMetresToAcres(row.area_m2);
  const crop = cropInfo(row.crop);
  const range = crop?.coloniesPerAcre ?? { min: row.colonies_per_acre, max: row.colonies_per_acre, typical: row.colonies_per_acre };
  return {
    id: row.id, farmId: row.farm_id, name: row.name, crop: row.crop as CropKey, variety: row.variety, pollinizerVariety: row.pollinizer_variety,
    yearPlanted: row.year_planted, treesPerAcre: row.trees_per_acre, notes: row.notes, outline: row.outline_json, location: row.location_json,
    enteredAcres: row.entered_acres, areaM2: row.area_m2, acres, areaSource: row.outline_json ? 'outline' : 'entered',
    coloniesPerAcre: row.colonies_per_acre, coloniesNeeded: coloniesNeeded(acres, row.colonies_per_acre),
    stocking: {
      ...range, source: crop?.stockingSource ?? 'No published range for this crop', note: crop?.stockingNote ?? null,
      advice: stockingAdvice(row.colonies_per_acre, range),
    },
    weatherStationId: row.weather_station_id, weatherStationName: row.station_name, degreeDayStart: row.degree_day_start,
    bloomWindow: row.bloom ? toBloomWindowDto(row.bloom) : null,
    createdAt: new Date(row.created_at).toISOString(), updatedAt: new Date(row.updated_at).toISOString(),
  };
}

export async function selectBlocks(sequelize: Sequelize, where: string, replacements: Record<string, unknown>): Promise<BlockDto[]> {
  const rows = await sequelize.query<BlockRow>(`${blockSelect} WHERE ${where} ORDER BY b.name`, { replacements, type: QueryTypes.SELECT });
  return rows.map(toBlockDto);
}

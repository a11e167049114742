// Blocks of a farm: create, read, change and remove, always scoped to the user's farm
// (another farm's block is "not found"). Outlines are checked by PostGIS (ST_IsValid)
// and their area is computed on the sphere (ST_Area on geography), in square metres.
import { QueryTypes, ForeignKeyConstraintError, UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { BlockBody, BlockDto, BlockPatch } from '../../../../shared/schemas/blocks.js';
import type { blockBody, blockPatch } from '../../../../shared/schemas/blocks.js';
import type { z } from 'zod';
import type { GeoPolygon } from '../../../../shared/schemas/common.js';
import { cropInfo } from '../../../../shared/domain/crops.js';
import { SQUARE_METRES_PER_ACRE } from '../../../../shared/domain/units.js';
import { badRequest, conflict, notFound } from '../../errors/http-errors.js';
import { selectBlocks } from './block-rows.js';

type CreateInput = z.output<typeof blockBody>;
type PatchInput = z.output<typeof blockPatch>;

export function createBlocksService(ctx: AppContext) {
  const { sequelize } = ctx;

  async function checkOutline(outline: GeoPolygon) {
    const [check] = await sequelize.query<{ valid: boolean; reason: string; area: number }>(
      `SELECT ST_IsValid(g) AS valid, ST_IsValidReason(g) AS reason, CASE WHEN ST_IsValid(g) THEN ST_Area(g::geography) ELSE 0 END AS area
       FROM (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326) AS g) s`,
      { replacements: { outline: JSON.stringify(outline) }, type: QueryTypes.SELECT },
    );
    if (!check.valid) {
      const reason = check.reason.replace(/\[.*\]$/, '').trim();
      throw badRequest(`The outline is not a valid polygon (${reason}): redraw it so its edges do not cross.`, {
        outline: `is not a valid polygon: ${reason}`,
      });
    }
    if (!(check.area > 1)) throw badRequest('The outline encloses no area.', { outline: 'encloses no area' });
  }

  async function checkStation(farmId: string, stationId: string | null | undefined) {
    if (!stationId) return;
    const [row] = await sequelize.query('SELECT 1 FROM weather_stations WHERE id = :stationId AND farm_id = :farmId', {
      replacements: { stationId, farmId }, type: QueryTypes.SELECT,
    });
    if (!row) throw badRequest('That weather station is not one of your farm\'s.', { weatherStationId: 'is not one of your farm\'s stations' });
  }

  const nameTaken = () => conflict('Your farm already has a block with that name.', { name: 'is already used by another block' });

  async function get(farmId: string, id: string): Promise<BlockDto> {
    const [block] = await selectBlocks(sequelize, 'b.id = :id AND b.farm_id = :farmId', { id, farmId });
    if (!block) throw notFound('That block');
    return block;
  }

  // Outline, location, entered acreage and area are written together so they always agree.
  const outlineExpr = 'CASE WHEN :outline::text IS NULL THEN NULL ELSE ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326) END';
  const locationExpr = `CASE WHEN :location::text IS NOT NULL THEN ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326)
    WHEN :outline::text IS NOT NULL THEN ST_PointOnSurface(ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326)) END`;
  const areaExpr = `CASE WHEN :outline::text IS NULL THEN :enteredAcres * ${SQUARE_METRES_PER_ACRE}
    ELSE ST_Area(ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326)::geography) END`;
  const areaSql = `outline = ${outlineExpr}, location = ${locationExpr}, entered_acres = :enteredAcres, area_m2 = ${areaExpr}`;

  return {
    list(farmId: string) {
      return selectBlocks(sequelize, 'b.farm_id = :farmId', { farmId });
    },

    get,

    async create(farmId: string, body: CreateInput): Promise<BlockDto> {
      if (body.outline) await checkOutline(body.outline);
      await checkStation(farmId, body.weatherStationId);
      const rate = body.coloniesPerAcre ?? cropInfo(body.crop)?.coloniesPerAcre.typical ?? 1;
      try {
        const [row] = await sequelize.query<{ id: string }>(
          `INSERT INTO blocks (farm_id, name, crop, variety, pollinizer_variety, year_planted, trees_per_acre, notes,
             colonies_per_acre, weather_station_id, degree_day_start, outline, location, entered_acres, area_m2)
           VALUES (:farmId, :name, :crop, :variety, :pollinizer, :yearPlanted, :treesPerAcre, :notes, :rate, :stationId, :ddStart,
             ${outlineExpr}, ${locationExpr}, :enteredAcres, ${areaExpr})
           RETURNING id`,
          {
            replacements: {
              farmId, name: body.name, crop: body.crop, variety: body.variety ?? null, pollinizer: body.pollinizerVariety ?? null,
              yearPlanted: body.yearPlanted ?? null, treesPerAcre: body.treesPerAcre ?? null, notes: body.notes ?? null, rate,
              stationId: body.weatherStationId ?? null, ddStart: body.degreeDayStart ?? null,
              outline: body.outline ? JSON.stringify(body.outline) : null, location: body.location ? JSON.stringify(body.location) : null,
              enteredAcres: body.outline ? null : body.enteredAcres ?? null,
            },
            type: QueryTypes.SELECT,
          },
        );
        return get(farmId, row.id);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
    },

    async update(farmId: string, id: string, patch: PatchInput): Promise<BlockDto> {
      const current = await get(farmId, id);
      if (patch.outline) await checkOutline(patch.outline);
      await checkStation(farmId, patch.weatherStationId);
      const outline = patch.outline === undefined ? current.outline : patch.outline;
      const enteredAcres = outline ? null : patch.enteredAcres ?? current.enteredAcres ?? (current.areaSource === 'outline' ? null : current.acres);
      if (!outline && !enteredAcres) {
        throw badRequest('A block without an outline needs its acreage.', { enteredAcres: 'draw or upload an outline, or enter the acreage' });
      }
      const next = { ...current, ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)) } as BlockDto & BlockPatch;
      const location = patch.location !== undefined ? patch.location : patch.outline !== undefined ? null : current.location;
      try {
        await sequelize.query(
          `UPDATE blocks SET name = :name, crop = :crop, variety = :variety, pollinizer_variety = :pollinizer, year_planted = :yearPlanted,
             trees_per_acre = :treesPerAcre, notes = :notes, colonies_per_acre = :rate, weather_station_id = :stationId,
             degree_day_start = :ddStart, updated_at = now(), ${areaSql}
           WHERE id = :id AND farm_id = :farmId`,
          {
            replacements: {
              id, farmId, name: next.name, crop: next.crop, variety: next.variety ?? null, pollinizer: next.pollinizerVariety ?? null,
              yearPlanted: next.yearPlanted ?? null, treesPerAcre: next.treesPerAcre ?? null, notes: next.notes ?? null,
              rate: next.coloniesPerAcre, stationId: next.weatherStationId ?? null, ddStart: next.degreeDayStart ?? null,
              outline: outline ? JSON.stringify(outline) : null, location: location ? JSON.stringify(location) : null, enteredAcres,
            },
          },
        );
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
      return get(farmId, id);
    },

    async remove(farmId: string, id: string): Promise<void> {
      await get(farmId, id);
      try {
        await sequelize.query('DELETE FROM blocks WHERE id = :id AND farm_id = :farmId', { replacements: { id, farmId } });
      } catch (err) {
        if (err instanceof ForeignKeyConstraintError) throw conflict('This block is part of a hive request; remove it from the request first.');
        throw err;
      }
    },
  };
}

export type BlocksService = ReturnType<typeof createBlocksService>;
export type { BlockBody };

// Blocks of a farm: create, read, change and remove, always scoped to the user's farm
// (another farm's block is "not found"). Outlines are checked by PostGIS (ST_IsValid)
// and their area is computed on the sphere (ST_Area on geography), in square metres.
import { ForeignKeyConstraintError, UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { BlockBody, BlockDto } from '../../../../shared/schemas/blocks.js';
import type { blockBody, blockPatch } from '../../../../shared/schemas/blocks.js';
import type { z } from 'zod';
import type { GeoPoint, GeoPolygon } from '../../../../shared/schemas/common.js';
import { cropInfo } from '../../../../shared/domain/crops.js';
import { SQUARE_METRES_PER_ACRE } from '../../../../shared/domain/units.js';
import type { Block } from '../../db/models/block.model.js';
import type { BloomWindow } from '../../db/models/bloom-window.model.js';
import { badRequest, conflict, notFound } from '../../errors/http-errors.js';
import { toBlockDto } from './block-dto.js';
import { outlineFacts, selectBlockList } from './blocks.queries.js';
import { blockPlaceChanged } from '../alerts/conflict-rechecks.js';

type CreateInput = z.output<typeof blockBody>;
type PatchInput = z.output<typeof blockPatch>;

export function createBlocksService(ctx: AppContext) {
  const { sequelize } = ctx;
  const { Block, BloomWindow, User, WeatherStation } = ctx.models;
  const withStation = [{ model: WeatherStation, as: 'weatherStation', attributes: ['name'] }];
  const blocksOf = (farmId: string) => Block.scope({ method: ['ofFarm', farmId] });

  /**
   * Outline, location, entered acreage and area are written together so they always agree:
   * with an outline the area is its geodesic area and the location (unless given) a point
   * inside it; without one the area comes from the entered acres.
   */
  async function placeOf(outline: GeoPolygon | null, location: GeoPoint | null, enteredAcres: number | null) {
    if (!outline) return { outline: null, location, enteredAcres, areaM2: (enteredAcres ?? 0) * SQUARE_METRES_PER_ACRE };
    const facts = await outlineFacts(sequelize, outline);
    if (!facts.valid) {
      const reason = facts.reason.replace(/\[.*\]$/, '').trim();
      throw badRequest(`The outline is not a valid polygon (${reason}): redraw it so its edges do not cross.`, {
        outline: `is not a valid polygon: ${reason}`,
      });
    }
    if (!(facts.areaM2 > 1)) throw badRequest('The outline encloses no area.', { outline: 'encloses no area' });
    return { outline, location: location ?? facts.pointInside, enteredAcres: null, areaM2: facts.areaM2 };
  }

  async function checkStation(farmId: string, stationId: string | null | undefined) {
    if (!stationId) return;
    if (!(await WeatherStation.scope({ method: ['ofFarm', farmId] }).count({ where: { id: stationId } }))) {
      throw badRequest('That weather station is not one of your farm\'s.', { weatherStationId: 'is not one of your farm\'s stations' });
    }
  }

  const nameTaken = () => conflict('Your farm already has a block with that name.', { name: 'is already used by another block' });

  /** Each block's current bloom window: the latest revision of its latest season. */
  async function currentWindows(blockIds: string[]): Promise<Map<string, BloomWindow>> {
    if (!blockIds.length) return new Map();
    const windows = await BloomWindow.findAll({
      where: { blockId: blockIds },
      include: [{ model: User, as: 'reviser', attributes: ['name'] }],
      order: [['season', 'DESC'], ['createdAt', 'DESC'], ['id', 'DESC']],
    });
    const current = new Map<string, BloomWindow>();
    for (const w of windows) if (!current.has(w.blockId)) current.set(w.blockId, w);
    return current;
  }

  async function toDtos(blocks: Block[]): Promise<BlockDto[]> {
    const windows = await currentWindows(blocks.map((b) => b.id));
    return blocks.map((b) => toBlockDto(b, windows.get(b.id) ?? null));
  }

  async function find(farmId: string, id: string): Promise<Block> {
    const block = await blocksOf(farmId).findOne({ where: { id }, include: withStation });
    if (!block) throw notFound('That block');
    return block;
  }

  async function get(farmId: string, id: string): Promise<BlockDto> {
    const [dto] = await toDtos([await find(farmId, id)]);
    return dto;
  }

  return {
    async list(farmId: string): Promise<BlockDto[]> {
      return (await selectBlockList(sequelize, farmId)).map(({ block, window }) => toBlockDto(block, window));
    },

    get,

    async create(farmId: string, body: CreateInput): Promise<BlockDto> {
      const place = await placeOf(body.outline ?? null, body.location ?? null, body.outline ? null : body.enteredAcres ?? null);
      await checkStation(farmId, body.weatherStationId);
      const rate = body.coloniesPerAcre ?? cropInfo(body.crop)?.coloniesPerAcre.typical ?? 1;
      try {
        const block = await Block.create({
          farmId, name: body.name, crop: body.crop, variety: body.variety ?? null, pollinizerVariety: body.pollinizerVariety ?? null,
          yearPlanted: body.yearPlanted ?? null, treesPerAcre: body.treesPerAcre ?? null, notes: body.notes ?? null, coloniesPerAcre: rate,
          weatherStationId: body.weatherStationId ?? null, degreeDayStart: body.degreeDayStart ?? null, ...place,
        });
        return get(farmId, block.id);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
    },

    async update(farmId: string, id: string, patch: PatchInput): Promise<BlockDto> {
      const block = await find(farmId, id);
      const [current] = await toDtos([block]);
      const outline = patch.outline === undefined ? current.outline : patch.outline;
      const location = patch.location !== undefined ? patch.location : patch.outline !== undefined ? null : current.location;
      const drawn = patch.outline ? await placeOf(patch.outline, location, null) : null;
      await checkStation(farmId, patch.weatherStationId);
      const enteredAcres = outline ? null : patch.enteredAcres ?? current.enteredAcres ?? (current.areaSource === 'outline' ? null : current.acres);
      if (!outline && !enteredAcres) {
        throw badRequest('A block without an outline needs its acreage.', { enteredAcres: 'draw or upload an outline, or enter the acreage' });
      }
      const place = drawn ?? (await placeOf(outline, location, enteredAcres));
      const given = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)) as Partial<PatchInput>;
      const moved = patch.outline !== undefined || patch.location !== undefined;
      try {
        await sequelize.transaction(async (transaction) => {
          await block.update({
            name: given.name ?? block.name, crop: given.crop ?? block.crop, variety: 'variety' in given ? given.variety ?? null : block.variety,
            pollinizerVariety: 'pollinizerVariety' in given ? given.pollinizerVariety ?? null : block.pollinizerVariety,
            yearPlanted: 'yearPlanted' in given ? given.yearPlanted ?? null : block.yearPlanted,
            treesPerAcre: 'treesPerAcre' in given ? given.treesPerAcre ?? null : block.treesPerAcre,
            notes: 'notes' in given ? given.notes ?? null : block.notes, coloniesPerAcre: given.coloniesPerAcre ?? block.coloniesPerAcre,
            weatherStationId: 'weatherStationId' in given ? given.weatherStationId ?? null : block.weatherStationId,
            degreeDayStart: 'degreeDayStart' in given ? given.degreeDayStart ?? null : block.degreeDayStart,
            ...place,
          }, { transaction });
          // Sprays on the block are re-checked against the drop sites it now reaches.
          if (moved) await blockPlaceChanged(ctx, transaction, id);
        });
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw nameTaken();
        throw err;
      }
      return get(farmId, id);
    },

    async remove(farmId: string, id: string): Promise<void> {
      const block = await find(farmId, id);
      try {
        await block.destroy();
      } catch (err) {
        if (err instanceof ForeignKeyConstraintError) throw conflict('This block is part of a hive request; remove it from the request first.');
        throw err;
      }
    },
  };
}

export type BlocksService = ReturnType<typeof createBlocksService>;
export type { BlockBody };

// Trap counts per block and the pest timing they give with the block's weather station, one
// season of the farm at a time, with the days a cover spray fits best marked against bloom
// and colonies on site.
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound } from '../../errors/http-errors.js';
import { pestTiming, seasonDays, seasonOf } from '../../../../shared/domain/pest-timing.js';
import { suggestCoverSprayDays, sprayWindowCaution } from '../../../../shared/domain/spray-windows.js';
import { loadSeasonTemperatures } from '../weather/season-temperatures.js';
import { sprayDayContext } from './pests.queries.js';
import type { PestModelDto, PestTimingDto, TrapCountDto, TrapCountInput } from '../../../../shared/schemas/pests.js';
import type { PestModel } from '../../db/models/pest-model.model.js';
import type { PestTrapCount } from '../../db/models/pest-trap-count.model.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';

const toPestModelDto = (m: PestModel): PestModelDto => ({
  id: m.id, name: m.name, lowerThresholdF: m.lowerThresholdF, upperThresholdF: m.upperThresholdF, method: m.method, cutoff: m.cutoff,
  biofixRule: m.biofixRule, stages: m.stages, source: m.source,
});
const toTrapCountDto = (c: PestTrapCount): TrapCountDto => ({ id: c.id, blockId: c.blockId, pestModelId: c.pestModelId, checkedOn: c.checkedOn, moths: c.moths });

export function createPestsService(ctx: AppContext) {
  const { Block, PestModel, PestTrapCount } = ctx.models;

  async function requireBlock(user: AuthUser, blockId: string, field?: string) {
    const block = await Block.findOne({ attributes: ['id', 'weatherStationId'], where: { id: blockId, farmId: user.organizationId! } });
    if (!block) throw field ? badRequest(pleaseCheck([field]), { [field]: 'must be one of your farm\'s blocks' }) : notFound('That block');
    return block;
  }

  async function requireModel(id: string): Promise<PestModelDto> {
    const model = await PestModel.findByPk(id);
    if (!model) throw badRequest(pleaseCheck(['pestModelId']), { pestModelId: 'is not a known pest model' });
    return toPestModelDto(model);
  }

  async function counts(blockId: string, pestModelId: string): Promise<TrapCountDto[]> {
    const rows = await PestTrapCount.findAll({ where: { blockId, pestModelId }, order: [['checkedOn', 'ASC']] });
    return rows.map(toTrapCountDto);
  }

  return {
    async models(): Promise<PestModelDto[]> {
      return (await PestModel.findAll({ order: [['name', 'ASC']] })).map(toPestModelDto);
    },

    async listCounts(user: AuthUser, blockId: string, pestModelId: string) {
      await requireBlock(user, blockId);
      return counts(blockId, pestModelId);
    },

    /** A second count for the same block, pest and day replaces the first (one trap check a day). */
    async record(user: AuthUser, input: TrapCountInput): Promise<TrapCountDto> {
      await requireBlock(user, input.blockId, 'blockId');
      await requireModel(input.pestModelId);
      const [row] = await PestTrapCount.bulkCreate(
        [{ blockId: input.blockId, pestModelId: input.pestModelId, checkedOn: input.checkedOn, moths: input.moths, recordedBy: user.id }],
        { updateOnDuplicate: ['moths', 'recordedBy'], conflictAttributes: ['blockId', 'pestModelId', 'checkedOn'], returning: true },
      );
      return toTrapCountDto(row);
    },

    /** Timing in one season of the farm (its calendar year in its time zone; this season unless asked), with suggested cover-spray days. */
    async timing(user: AuthUser, blockId: string, pestModelId: string, askedSeason?: number): Promise<PestTimingDto> {
      const block = await requireBlock(user, blockId);
      const model = await requireModel(pestModelId);
      const farm = await ctx.models.Organization.findByPk(user.organizationId!, { attributes: ['timeZone'] });
      const timeZone = farm?.timeZone ?? 'UTC';
      const season = askedSeason ?? seasonOf(ctx.now(), timeZone);
      const allChecks = (await counts(blockId, pestModelId)).map((c) => ({ day: c.checkedOn, moths: c.moths }));
      const { from, to } = seasonDays(season);
      const temperatures = block.weatherStationId ? await loadSeasonTemperatures(ctx, block.weatherStationId, from, to) : null;
      const timing = pestTiming(
        { lowerThresholdF: model.lowerThresholdF, upperThresholdF: model.upperThresholdF, method: 'single-sine', stages: model.stages },
        allChecks,
        temperatures?.days ?? [],
        season,
      );
      const seasons = [...new Set([season, ...allChecks.map((c) => Number(c.day.slice(0, 4)))])].sort((a, b) => b - a);
      const suggestedSprayDays = suggestCoverSprayDays(timing, await sprayDayContext(ctx.sequelize, blockId, timeZone, season));
      return { ...timing, pestModelId, blockId, hasWeather: Boolean(temperatures?.lastObserved), seasons, suggestedSprayDays, sprayWindowCaution };
    },
  };
}

export type PestsService = ReturnType<typeof createPestsService>;

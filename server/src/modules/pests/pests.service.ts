// Trap counts per block and the pest timing they give with the block's weather station.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound } from '../../errors/http-errors.js';
import { pestTiming } from '../../../../shared/domain/pest-timing.js';
import type { PestModelDto, PestTimingDto, TrapCountDto, TrapCountInput } from '../../../../shared/schemas/pests.js';
import { PestModel } from '../../db/models/pest-model.model.js';

const cToF = (c: number) => (c * 9) / 5 + 32;

export function createPestsService(ctx: AppContext) {
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => ctx.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  async function requireBlock(user: AuthUser, blockId: string, field?: string) {
    const [row] = await q<{ id: string; weather_station_id: string | null }>(
      'SELECT id, weather_station_id FROM blocks WHERE id = :blockId AND farm_id = :farmId', { blockId, farmId: user.organizationId },
    );
    if (!row) throw field ? badRequest(`Please check: ${field}.`, { [field]: 'must be one of your farm\'s blocks' }) : notFound('That block');
    return row;
  }

  async function requireModel(id: string): Promise<PestModelDto> {
    const model = await PestModel.findByPk(id);
    if (!model) throw badRequest('Please check: pestModelId.', { pestModelId: 'is not a known pest model' });
    return model.get({ plain: true });
  }

  async function counts(blockId: string, pestModelId: string): Promise<TrapCountDto[]> {
    return q<TrapCountDto>(
      `SELECT id, block_id AS "blockId", pest_model_id AS "pestModelId", to_char(checked_on, 'YYYY-MM-DD') AS "checkedOn", moths
       FROM pest_trap_counts WHERE block_id = :blockId AND pest_model_id = :pestModelId ORDER BY checked_on`, { blockId, pestModelId },
    );
  }

  return {
    async models(): Promise<PestModelDto[]> {
      return (await PestModel.findAll({ order: [['name', 'ASC']] })).map((m) => m.get({ plain: true }));
    },

    async listCounts(user: AuthUser, blockId: string, pestModelId: string) {
      await requireBlock(user, blockId);
      return counts(blockId, pestModelId);
    },

    async record(user: AuthUser, input: TrapCountInput): Promise<TrapCountDto> {
      await requireBlock(user, input.blockId, 'blockId');
      await requireModel(input.pestModelId);
      const [row] = await q<TrapCountDto>(
        `INSERT INTO pest_trap_counts (block_id, pest_model_id, checked_on, moths, recorded_by) VALUES (:blockId, :pestModelId, :checkedOn, :moths, :userId)
         ON CONFLICT (block_id, pest_model_id, checked_on) DO UPDATE SET moths = EXCLUDED.moths, recorded_by = EXCLUDED.recorded_by
         RETURNING id, block_id AS "blockId", pest_model_id AS "pestModelId", to_char(checked_on, 'YYYY-MM-DD') AS "checkedOn", moths`,
        { ...input, userId: user.id },
      );
      return row;
    },

    async timing(user: AuthUser, blockId: string, pestModelId: string): Promise<PestTimingDto> {
      const block = await requireBlock(user, blockId);
      const model = await requireModel(pestModelId);
      const checks = (await counts(blockId, pestModelId)).map((c) => ({ day: c.checkedOn, moths: c.moths }));
      const days = block.weather_station_id
        ? await q<{ day: string; tmin_c: number; tmax_c: number }>(
            `SELECT to_char(day, 'YYYY-MM-DD') AS day, tmin_c, tmax_c FROM daily_temperatures WHERE station_id = :stationId ORDER BY day`,
            { stationId: block.weather_station_id },
          )
        : [];
      const timing = pestTiming(
        { lowerThresholdF: model.lowerThresholdF, upperThresholdF: model.upperThresholdF, method: 'single-sine', stages: model.stages },
        checks,
        days.map((d) => ({ day: d.day, tmin: cToF(Number(d.tmin_c)), tmax: cToF(Number(d.tmax_c)) })),
      );
      return { ...timing, pestModelId, blockId, hasWeather: days.length > 0 };
    },
  };
}

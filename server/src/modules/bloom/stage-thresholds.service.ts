// Crop stage thresholds (degree days, °F as published) and frost critical temperatures:
// sourced, editable reference data. A farm's own thresholds for a crop (and variety)
// replace the published defaults for its blocks.
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type {
  FrostCriticalDto, StageThresholdDto, frostCriticalPatch, stageThresholdBody, stageThresholdPatch,
} from '../../../../shared/schemas/weather.js';
import { badRequest, conflict, forbidden, notFound } from '../../errors/http-errors.js';

interface ThresholdRow {
  id: string; farm_id: string | null; crop: string; variety: string | null; stage: string; label: string; sort_order: number;
  base_f: number; upper_f: number | null; method: StageThresholdDto['method']; start_month_day: string; dd_low_f: number; dd_high_f: number; source: string;
}

const toThreshold = (r: ThresholdRow): StageThresholdDto => ({
  id: r.id, farmId: r.farm_id, crop: r.crop, variety: r.variety, stage: r.stage, label: r.label, sortOrder: r.sort_order,
  baseF: r.base_f, upperF: r.upper_f, method: r.method, startMonthDay: r.start_month_day, ddLowF: r.dd_low_f, ddHighF: r.dd_high_f, source: r.source,
});

interface FrostRow { id: string; crop: string; stage_label: string; stage: string | null; sort_order: number; kill10_f: number; kill90_f: number; source: string }
const toFrost = (r: FrostRow): FrostCriticalDto => ({
  id: r.id, crop: r.crop, stageLabel: r.stage_label, stage: r.stage, sortOrder: r.sort_order, kill10F: r.kill10_f, kill90F: r.kill90_f, source: r.source,
});

export function createStageThresholdsService(ctx: AppContext) {
  const { sequelize } = ctx;

  /** Published rows are the admin's to change; a farm's own rows are only ever found for that farm. */
  function assertMayEdit(user: AuthUser, farmId: string | null) {
    if (farmId === null && user.roleKey !== 'admin') {
      throw forbidden('Only the platform admin changes the published defaults; add your farm\'s own thresholds instead.');
    }
  }

  return {
    /** Published defaults and the user's farm's own rows. */
    async list(user: AuthUser, crop?: string): Promise<StageThresholdDto[]> {
      const rows = await sequelize.query<ThresholdRow>(
        `SELECT * FROM crop_stage_thresholds WHERE (farm_id IS NULL OR farm_id = :farmId) AND (:crop::text IS NULL OR crop = :crop)
         ORDER BY crop, farm_id NULLS FIRST, variety NULLS FIRST, sort_order, dd_low_f`,
        { replacements: { farmId: user.organizationId, crop: crop ?? null }, type: QueryTypes.SELECT },
      );
      return rows.map(toThreshold);
    },

    /** The one set that applies to a block: the farm's own for the variety, the farm's for the crop, then the published ones. */
    async forBlock(farmId: string, crop: string, variety: string | null): Promise<StageThresholdDto[]> {
      const rows = await sequelize.query<ThresholdRow>(
        `WITH candidates AS (
           SELECT *, (farm_id IS NOT NULL)::int * 2 + (variety IS NOT NULL)::int AS rank FROM crop_stage_thresholds
           WHERE crop = :crop AND (farm_id IS NULL OR farm_id = :farmId) AND (variety IS NULL OR lower(variety) = lower(:variety::text)))
         SELECT * FROM candidates WHERE rank = (SELECT max(rank) FROM candidates) ORDER BY sort_order, dd_low_f`,
        { replacements: { farmId, crop, variety }, type: QueryTypes.SELECT },
      );
      return rows.map(toThreshold);
    },

    async create(user: AuthUser, body: z.output<typeof stageThresholdBody>): Promise<StageThresholdDto> {
      const farmId = user.roleKey === 'admin' ? null : user.organizationId;
      try {
        const [row] = await sequelize.query<ThresholdRow>(
          `INSERT INTO crop_stage_thresholds (farm_id, crop, variety, stage, label, sort_order, base_f, upper_f, method, start_month_day, dd_low_f, dd_high_f, source, updated_by)
           VALUES (:farmId, :crop, :variety, :stage, :label, :sortOrder, :baseF, :upperF, :method, :startMonthDay, :ddLowF, :ddHighF, :source, :userId) RETURNING *`,
          { replacements: { ...body, variety: body.variety ?? null, upperF: body.upperF ?? null, farmId, userId: user.id }, type: QueryTypes.SELECT },
        );
        return toThreshold(row);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw conflict('That stage already has a threshold for this crop and variety.', { stage: 'already has a threshold' });
        throw err;
      }
    },

    async update(user: AuthUser, id: string, patch: z.output<typeof stageThresholdPatch>): Promise<StageThresholdDto> {
      const [current] = await sequelize.query<ThresholdRow>('SELECT * FROM crop_stage_thresholds WHERE id = :id AND (farm_id IS NULL OR farm_id = :farmId)', {
        replacements: { id, farmId: user.organizationId }, type: QueryTypes.SELECT,
      });
      if (!current) throw notFound('That threshold');
      assertMayEdit(user, current.farm_id);
      const next = { label: patch.label ?? current.label, ddLowF: patch.ddLowF ?? current.dd_low_f, ddHighF: patch.ddHighF ?? current.dd_high_f, source: patch.source ?? current.source };
      if (next.ddHighF < next.ddLowF) throw badRequest('The high end must not be below the low end.', { ddHighF: 'must not be below the low end' });
      const [row] = await sequelize.query<ThresholdRow>(
        `UPDATE crop_stage_thresholds SET label = :label, dd_low_f = :ddLowF, dd_high_f = :ddHighF, source = :source, updated_by = :userId, updated_at = now()
         WHERE id = :id RETURNING *`,
        { replacements: { ...next, id, userId: user.id }, type: QueryTypes.SELECT },
      );
      return toThreshold(row);
    },

    async frostCritical(crop?: string): Promise<FrostCriticalDto[]> {
      const rows = await sequelize.query<FrostRow>(
        'SELECT * FROM frost_critical_temperatures WHERE (:crop::text IS NULL OR crop = :crop) ORDER BY crop, sort_order',
        { replacements: { crop: crop ?? null }, type: QueryTypes.SELECT },
      );
      return rows.map(toFrost);
    },

    async frostForStage(crop: string, stage: string): Promise<FrostCriticalDto | null> {
      const [row] = await sequelize.query<FrostRow>('SELECT * FROM frost_critical_temperatures WHERE crop = :crop AND stage = :stage ORDER BY sort_order DESC LIMIT 1', {
        replacements: { crop, stage }, type: QueryTypes.SELECT,
      });
      return row ? toFrost(row) : null;
    },

    async updateFrostCritical(user: AuthUser, id: string, patch: z.output<typeof frostCriticalPatch>): Promise<FrostCriticalDto> {
      const [current] = await sequelize.query<FrostRow>('SELECT * FROM frost_critical_temperatures WHERE id = :id', { replacements: { id }, type: QueryTypes.SELECT });
      if (!current) throw notFound('That critical temperature');
      const next = { kill10F: patch.kill10F ?? current.kill10_f, kill90F: patch.kill90F ?? current.kill90_f, source: patch.source ?? current.source };
      if (next.kill90F > next.kill10F) throw badRequest('The 90% kill temperature must not be above the 10% one.', { kill90F: 'must not be above the 10% kill temperature' });
      const [row] = await sequelize.query<FrostRow>(
        `UPDATE frost_critical_temperatures SET kill10_f = :kill10F, kill90_f = :kill90F, source = :source, updated_by = :userId, updated_at = now() WHERE id = :id RETURNING *`,
        { replacements: { ...next, id, userId: user.id }, type: QueryTypes.SELECT },
      );
      return toFrost(row);
    },
  };
}

export type StageThresholdsService = ReturnType<typeof createStageThresholdsService>;

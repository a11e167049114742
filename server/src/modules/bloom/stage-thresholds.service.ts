// Crop stage thresholds (degree days, °F as published) and frost critical temperatures:
// sourced, editable reference data. A farm's own thresholds for a crop (and variety)
// replace the published defaults for its blocks.
import { Op, UniqueConstraintError, fn, col, where as whereSql } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type {
  FrostCriticalDto, StageThresholdDto, frostCriticalPatch, stageThresholdBody, stageThresholdPatch,
} from '../../../../shared/schemas/weather.js';
import type { CropStageThreshold } from '../../db/models/crop-stage-threshold.model.js';
import type { FrostCriticalTemperature } from '../../db/models/frost-critical-temperature.model.js';
import { badRequest, conflict, forbidden, notFound } from '../../errors/http-errors.js';
import { isAllowed } from '../../../../shared/policies/policy-table.js';
import { bloomPolicy } from './bloom.policy.js';

const toThreshold = (t: CropStageThreshold): StageThresholdDto => ({
  id: t.id, farmId: t.farmId, crop: t.crop, variety: t.variety, stage: t.stage, label: t.label, sortOrder: t.sortOrder,
  baseF: t.baseF, upperF: t.upperF, method: t.method, startMonthDay: t.startMonthDay, ddLowF: t.ddLowF, ddHighF: t.ddHighF, source: t.source,
});

const toFrost = (f: FrostCriticalTemperature): FrostCriticalDto => ({
  id: f.id, crop: f.crop, stageLabel: f.stageLabel, stage: f.stage, sortOrder: f.sortOrder, kill10F: f.kill10F, kill90F: f.kill90F, source: f.source,
});

/** Published rows (no farm) and, for a farm member, the farm's own. */
const publishedOr = (farmId: string | null) => ({ [Op.or]: [{ farmId: null }, ...(farmId ? [{ farmId }] : [])] });

const bySortThenLow = (a: CropStageThreshold, b: CropStageThreshold) => a.sortOrder - b.sortOrder || a.ddLowF - b.ddLowF;

export function createStageThresholdsService(ctx: AppContext) {
  const { CropStageThreshold, FrostCriticalTemperature } = ctx.models;

  /** Published rows are the admin's to change; a farm's own rows are only ever found for that farm. */
  function assertMayEdit(user: AuthUser, farmId: string | null) {
    if (farmId === null && !isAllowed(bloomPolicy, 'editPublishedReference', user.roleKey)) {
      throw forbidden('Only the platform admin changes the published defaults; add your farm\'s own thresholds instead.');
    }
  }

  return {
    /** Published defaults and the user's farm's own rows. */
    async list(user: AuthUser, crop?: string): Promise<StageThresholdDto[]> {
      const rows = await CropStageThreshold.findAll({
        where: { ...publishedOr(user.organizationId), ...(crop ? { crop } : {}) },
        order: [['crop', 'ASC'], ['farmId', 'ASC NULLS FIRST'], ['variety', 'ASC NULLS FIRST'], ['sortOrder', 'ASC'], ['ddLowF', 'ASC']],
      });
      return rows.map(toThreshold);
    },

    /** The one set that applies to a block: the farm's own for the variety, the farm's for the crop, then the published ones. */
    async forBlock(farmId: string, crop: string, variety: string | null): Promise<StageThresholdDto[]> {
      const candidates = await CropStageThreshold.findAll({
        where: {
          crop, ...publishedOr(farmId),
          [Op.and]: [{ [Op.or]: [{ variety: null }, ...(variety ? [whereSql(fn('lower', col('variety')), variety.toLowerCase())] : [])] }],
        },
      });
      const rank = (t: CropStageThreshold) => (t.farmId !== null ? 2 : 0) + (t.variety !== null ? 1 : 0);
      const best = Math.max(...candidates.map(rank));
      return candidates.filter((t) => rank(t) === best).sort(bySortThenLow).map(toThreshold);
    },

    async create(user: AuthUser, body: z.output<typeof stageThresholdBody>): Promise<StageThresholdDto> {
      const farmId = user.roleKey === 'admin' ? null : user.organizationId;
      try {
        const row = await CropStageThreshold.create({
          farmId, crop: body.crop, variety: body.variety ?? null, stage: body.stage, label: body.label, sortOrder: body.sortOrder,
          baseF: body.baseF, upperF: body.upperF ?? null, method: body.method, startMonthDay: body.startMonthDay,
          ddLowF: body.ddLowF, ddHighF: body.ddHighF, source: body.source, updatedBy: user.id,
        });
        return toThreshold(row);
      } catch (err) {
        if (err instanceof UniqueConstraintError) throw conflict('That stage already has a threshold for this crop and variety.', { stage: 'already has a threshold' });
        throw err;
      }
    },

    async update(user: AuthUser, id: string, patch: z.output<typeof stageThresholdPatch>): Promise<StageThresholdDto> {
      const current = await CropStageThreshold.findOne({ where: { id, ...publishedOr(user.organizationId) } });
      if (!current) throw notFound('That threshold');
      assertMayEdit(user, current.farmId);
      const next = { label: patch.label ?? current.label, ddLowF: patch.ddLowF ?? current.ddLowF, ddHighF: patch.ddHighF ?? current.ddHighF, source: patch.source ?? current.source };
      if (next.ddHighF < next.ddLowF) throw badRequest('The high end must not be below the low end.', { ddHighF: 'must not be below the low end' });
      await current.update({ ...next, updatedBy: user.id });
      return toThreshold(current);
    },

    async frostCritical(crop?: string): Promise<FrostCriticalDto[]> {
      const rows = await FrostCriticalTemperature.findAll({ where: crop ? { crop } : {}, order: [['crop', 'ASC'], ['sortOrder', 'ASC']] });
      return rows.map(toFrost);
    },

    async frostForStage(crop: string, stage: string): Promise<FrostCriticalDto | null> {
      const row = await FrostCriticalTemperature.findOne({ where: { crop, stage }, order: [['sortOrder', 'DESC']] });
      return row ? toFrost(row) : null;
    },

    async updateFrostCritical(user: AuthUser, id: string, patch: z.output<typeof frostCriticalPatch>): Promise<FrostCriticalDto> {
      const current = await FrostCriticalTemperature.findByPk(id);
      if (!current) throw notFound('That critical temperature');
      const next = { kill10F: patch.kill10F ?? current.kill10F, kill90F: patch.kill90F ?? current.kill90F, source: patch.source ?? current.source };
      if (next.kill90F > next.kill10F) throw badRequest('The 90% kill temperature must not be above the 10% one.', { kill90F: 'must not be above the 10% kill temperature' });
      await current.update({ ...next, updatedBy: user.id });
      return toFrost(current);
    },
  };
}

export type StageThresholdsService = ReturnType<typeof createStageThresholdsService>;

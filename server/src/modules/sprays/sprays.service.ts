// Spray plans of a farm: plan, change, move, apply, cancel. Each save runs in one
// transaction: the plan's rows, the one conflict check the answer is built from, the alerts
// it raises or clears with their publication jobs, and a durable re-check job (which
// re-reads after the commit, so a placement changed while the save ran is not missed). The
// plan's map (its blocks and buffer) is read for the answer after the commit.
// Every query is scoped to the user's farm.
import { randomUUID } from 'node:crypto';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { SprayPlan } from '../../db/models/spray-plan.model.js';
import { notFound, wrongState, badRequest } from '../../errors/http-errors.js';
import { productBeeHazard } from '../../../../shared/domain/bee-toxicity.js';
import type { SprayApply, SprayDto, SprayInput, SprayState, SprayUpdate, SprayWithCheck } from '../../../../shared/schemas/sprays.js';
import { runConflictCheck, type CheckOutput } from '../conflicts/conflict-check.js';
import { checkStoredSpray, loadStoredSpray, storedSprayOf, type StoredSpray } from '../conflicts/stored-spray-check.js';
import { exposureEnd, sprayWindow } from '../conflicts/spray-window.js';
import { recheckSprayIn } from '../alerts/alert-recheck.js';
import { sprayChanged } from '../alerts/conflict-rechecks.js';
import { blocksOfSprays, bufferArea } from './sprays.queries.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { sprayStateSet } from '../../../../shared/labels/sprays.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';
import { keyUsedElsewhere } from '../../middleware/idempotency-key.js';
import { databaseRetryAfterSeconds, isDatabaseUnavailable, mayHaveBeenSaved } from '../../errors/database-unavailable.js';

/** A new plan sent under an Idempotency-Key: the key and the hash of the request it names. */
export interface SaveOnce { key: string; requestHash: string }
const createPath = '/api/sprays';

type Window = SprayPlan['plannedWindow'];
const windowOf = (from: Date, to: Date): Window => [{ value: from, inclusive: true }, { value: to, inclusive: false }];

function publicCheck(check: CheckOutput): SprayWithCheck['check'] {
  const { blocks: _blocks, ...rest } = check;
  return rest;
}

function farmOf(user: AuthUser): string {
  if (!user.organizationId || user.organizationKind !== 'farm') throw notFound('That spray plan');
  return user.organizationId;
}

export function createSpraysService(ctx: AppContext) {
  const { SprayPlan, SprayPlanBlock, Block, Organization, Alert, IdempotencyKey } = ctx.models;

  const dtoOf = (p: SprayPlan, blocks: SprayDto['blocks'], openAlerts: number): SprayDto => ({
    id: p.id, farmId: p.farmId, state: p.state, startsAt: p.plannedWindow[0].value.toISOString(), endsAt: p.plannedWindow[1].value.toISOString(),
    appliedAt: p.appliedAt?.toISOString() ?? null, productName: p.productName, epaRegNo: p.epaRegNo, activeIngredients: p.activeIngredients,
    ld50UgPerBee: p.ld50UgPerBee, rt25Hours: p.rt25Hours, targetPest: p.targetPest, applicatorName: p.applicatorName, notes: p.notes,
    blocks, hazard: productBeeHazard({ ld50UgPerBee: p.ld50UgPerBee, rt25Hours: p.rt25Hours }),
    openAlerts, createdAt: p.createdAt.toISOString(), updatedAt: p.updatedAt.toISOString(),
  });

  async function toDtos(plans: SprayPlan[]): Promise<SprayDto[]> {
    if (!plans.length) return [];
    const ids = plans.map((p) => p.id);
    const blocks = await blocksOfSprays(ctx.sequelize, ids);
    const open = await Alert.count({ where: { sprayPlanId: ids, state: { [Op.ne]: 'resolved' } }, group: ['sprayPlanId'] });
    const openBySpray = new Map(open.map((o) => [String(o.sprayPlanId), o.count]));
    return plans.map((p) => dtoOf(p, blocks.get(p.id) ?? [], openBySpray.get(p.id) ?? 0));
  }

  async function requireOwnBlocks(farmId: string, blockIds: string[], transaction?: Transaction): Promise<string[]> {
    const unique = [...new Set(blockIds)];
    const found = await Block.count({ where: { farmId, id: unique }, transaction });
    if (found !== unique.length) throw badRequest(pleaseCheck(['blockIds']), { blockIds: 'every block must be one of your farm\'s blocks' });
    return unique;
  }

  /** The farm's own plan, locked for a change in this transaction. */
  async function lockOwn(farmId: string, id: string, transaction: Transaction): Promise<SprayPlan> {
    const plan = await SprayPlan.findOne({ where: { id, farmId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) throw notFound('That spray plan');
    return plan;
  }

  /** What a save's work leaves: the plan, and for a new one the plan as the check reads it. */
  type Saved = { plan: SprayPlan; justCreated?: StoredSpray };

  const mapOf = (buffer: string | null): SprayWithCheck['buffer'] => (buffer ? JSON.parse(buffer) : null);

  /**
   * A save in one transaction: the plan's rows, then its durable re-check job and the one
   * check, which raises or clears its alerts (published as the transaction commits). The
   * answer is read after the commit, so the alerts go out without waiting for it; every
   * alert left open is one of the check's conflicts.
   */
  async function save(work: (t: Transaction) => Promise<Saved>): Promise<SprayWithCheck> {
    let committing = false;
    const { plan, check } = await ctx.sequelize.transaction(async (transaction) => {
      const saved = await work(transaction);
      await sprayChanged(ctx, transaction, saved.plan.id);
      const result = { plan: saved.plan, check: (await recheckSprayIn(ctx, transaction, saved.plan.id, saved.justCreated)).check! };
      committing = true;
      return result;
    }).catch((err: unknown) => {
      if (committing && isDatabaseUnavailable(err)) {
        throw mayHaveBeenSaved('the spray plan', `Please try again in ${databaseRetryAfterSeconds} seconds: the spray form sends the same plan again and it is kept once (look at the spray list first if you saved it elsewhere).`);
      }
      throw err;
    });
    const [blocks, buffer] = await Promise.all([blocksOfSprays(ctx.sequelize, [plan.id]), bufferArea(ctx.sequelize, plan.id)]);
    return { spray: dtoOf(plan, blocks.get(plan.id) ?? [], check.conflicts.length), check: publicCheck(check), buffer: mapOf(buffer) };
  }

  const service = {
    async list(user: AuthUser, state?: SprayState): Promise<SprayDto[]> {
      const farmId = farmOf(user);
      const plans = await SprayPlan.findAll({ where: { farmId, ...(state ? { state } : {}) }, order: [['plannedWindow', 'DESC']] });
      return toDtos(plans);
    },

    async get(user: AuthUser, id: string): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      const stored = await loadStoredSpray(ctx, id);
      if (!stored || stored.farmId !== farmId) throw notFound('That spray plan');
      const check = await checkStoredSpray(ctx, stored);
      const plan = await SprayPlan.findOne({ where: { id, farmId } });
      if (!plan) throw notFound('That spray plan');
      const [[spray], buffer] = await Promise.all([toDtos([plan]), bufferArea(ctx.sequelize, id)]);
      return { spray, check: publicCheck(stored.state === 'cancelled' ? { ...check, conflicts: [] } : check), buffer: mapOf(buffer) };
    },

    /** The dry run: the same check, nothing stored. */
    async check(user: AuthUser, input: SprayInput): Promise<SprayWithCheck['check']> {
      const farmId = farmOf(user);
      const blockIds = await requireOwnBlocks(farmId, input.blockIds);
      const farm = await Organization.findByPk(farmId, { attributes: ['sprayBufferM'] });
      const check = await runConflictCheck(ctx.sequelize, {
        farmId, blockIds, from: new Date(input.startsAt), to: new Date(input.endsAt), ld50UgPerBee: input.ld50UgPerBee, rt25Hours: input.rt25Hours,
        bufferM: farm!.sprayBufferM, noticedAt: ctx.now(),
      });
      return publicCheck(check);
    },

    /**
     * A new plan. Sent under a key (`once`), the key is written first in the plan's own
     * transaction, so the plan exists exactly when its key does: the same request sent
     * again (the answer was lost, the database dropped at the commit) waits for the first
     * to end, then gets that plan as it is now (`replayed`) and changes nothing; a key
     * used for a different request is a 422.
     */
    async create(user: AuthUser, input: SprayInput, once?: SaveOnce): Promise<SprayWithCheck & { replayed?: true }> {
      const farmId = farmOf(user);
      const planId = randomUUID();
      try {
        return await save(async (transaction) => {
          if (once) {
            await IdempotencyKey.create({
              userId: user.id, key: once.key, method: 'POST', path: createPath, requestHash: once.requestHash,
              responseStatus: 201, responseBody: { sprayId: planId } as object, completedAt: ctx.now(),
            }, { transaction });
          }
          return createPlan(transaction);
        });
      } catch (err) {
        if (!once || !(err instanceof UniqueConstraintError)) throw err;
        const first = await IdempotencyKey.findOne({ where: { userId: user.id, key: once.key } });
        if (!first) throw err;
        if (first.path !== createPath || first.requestHash !== once.requestHash) throw keyUsedElsewhere();
        return { ...(await service.get(user, (first.responseBody as { sprayId: string }).sprayId)), replayed: true };
      }

      async function createPlan(transaction: Transaction): Promise<Saved> {
        const blockIds = await requireOwnBlocks(farmId, input.blockIds, transaction);
        const from = new Date(input.startsAt);
        const to = new Date(input.endsAt);
        const plan = await SprayPlan.create({
          id: planId, farmId, plannedWindow: windowOf(from, to), exposureWindow: windowOf(from, exposureEnd(to, input)), appliedAt: null,
          productName: input.productName, epaRegNo: input.epaRegNo, activeIngredients: input.activeIngredients, ld50UgPerBee: input.ld50UgPerBee,
          rt25Hours: input.rt25Hours, targetPest: input.targetPest, applicatorName: input.applicatorName, notes: input.notes,
          noticedAt: ctx.now(), createdBy: user.id,
        }, { transaction });
        await SprayPlanBlock.bulkCreate(blockIds.map((blockId) => ({ sprayPlanId: plan.id, blockId })), { transaction });
        const farm = await Organization.findByPk(farmId, { attributes: ['id', 'name', 'timeZone', 'sprayBufferM'], transaction });
        return { plan, justCreated: storedSprayOf(plan, blockIds, farm!) };
      }
    },

    update(user: AuthUser, id: string, patch: SprayUpdate): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      return save(async (transaction) => {
        const plan = await lockOwn(farmId, id, transaction);
        if (plan.state !== 'planned') throw wrongState(`This spray is ${labelOf(sprayStateSet, plan.state).toLowerCase()}; only a planned spray can be changed.`);
        const blockIds = patch.blockIds ? await requireOwnBlocks(farmId, patch.blockIds, transaction) : null;
        const current = plan.plannedWindow;
        const from = patch.startsAt ? new Date(patch.startsAt) : current[0].value;
        const to = patch.endsAt ? new Date(patch.endsAt) : current[1].value;
        const moved = from.getTime() !== current[0].value.getTime() || to.getTime() !== current[1].value.getTime() || blockIds !== null;
        const ld50 = patch.ld50UgPerBee !== undefined ? patch.ld50UgPerBee : plan.ld50UgPerBee;
        const rt25 = patch.rt25Hours !== undefined ? patch.rt25Hours : plan.rt25Hours;
        const pick = <K extends keyof SprayUpdate & keyof SprayPlan>(key: K) => (patch[key] !== undefined ? patch[key] : plan[key]);
        await plan.update({
          plannedWindow: windowOf(from, to), exposureWindow: windowOf(from, exposureEnd(to, { ld50UgPerBee: ld50, rt25Hours: rt25 })),
          productName: pick('productName') as string, epaRegNo: pick('epaRegNo') as string | null,
          activeIngredients: (pick('activeIngredients') as string[] | null) ?? [], ld50UgPerBee: ld50, rt25Hours: rt25,
          targetPest: pick('targetPest') as string | null, applicatorName: pick('applicatorName') as string | null, notes: pick('notes') as string | null,
          ...(moved ? { noticedAt: ctx.now() } : {}),
        }, { transaction });
        if (blockIds) {
          await SprayPlanBlock.destroy({ where: { sprayPlanId: id }, transaction });
          await SprayPlanBlock.bulkCreate(blockIds.map((blockId) => ({ sprayPlanId: id, blockId })), { transaction });
        }
        return { plan };
      });
    },

    apply(user: AuthUser, id: string, input: SprayApply): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      return save(async (transaction) => {
        const plan = await lockOwn(farmId, id, transaction);
        if (plan.state !== 'planned') throw wrongState(`This spray is ${labelOf(sprayStateSet, plan.state).toLowerCase()}; only a planned spray can be recorded as applied.`);
        const appliedAt = new Date(input.appliedAt);
        if (appliedAt.getTime() > ctx.now().getTime() + 5 * 60_000) throw badRequest(pleaseCheck(['appliedAt']), { appliedAt: 'cannot be in the future' });
        const window = sprayWindow({ startsAt: plan.plannedWindow[0].value, endsAt: plan.plannedWindow[1].value, appliedAt });
        await plan.update({
          state: 'applied', appliedAt,
          exposureWindow: windowOf(window.from, exposureEnd(window.to, { ld50UgPerBee: plan.ld50UgPerBee, rt25Hours: plan.rt25Hours })),
        }, { transaction });
        return { plan };
      });
    },

    cancel(user: AuthUser, id: string): Promise<SprayWithCheck> {
      const farmId = farmOf(user);
      return save(async (transaction) => {
        const plan = await lockOwn(farmId, id, transaction);
        if (plan.state !== 'planned') throw wrongState(`This spray is ${labelOf(sprayStateSet, plan.state).toLowerCase()}; only a planned spray can be cancelled.`);
        await plan.update({ state: 'cancelled' }, { transaction });
        return { plan };
      });
    },
  };
  return service;
}

export type SpraysService = ReturnType<typeof createSpraysService>;

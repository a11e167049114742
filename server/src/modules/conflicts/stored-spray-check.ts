// Runs the conflict check of a stored spray plan, from its own row and its farm's buffer,
// on the caller's transaction (locking the plan's row when the caller will write alerts).
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';
import type { SprayPlan } from '../../db/models/spray-plan.model.js';
import type { Organization } from '../../db/models/organization.model.js';
import { runConflictCheck, type CheckOutput } from './conflict-check.js';
import { sprayWindow } from './spray-window.js';

export interface StoredSpray {
  id: string;
  farmId: string;
  state: SprayState;
  startsAt: Date;
  endsAt: Date;
  appliedAt: Date | null;
  ld50UgPerBee: number | null;
  rt25Hours: number | null;
  noticedAt: Date;
  productName: string;
  epaRegNo: string | null;
  farm: { id: string; name: string; timeZone: string };
  sprayBufferM: number;
  blockIds: string[];
}

/** The stored spray as the check reads it, from its row, its blocks and its farm. */
export function storedSprayOf(spray: SprayPlan, blockIds: string[], farm: Pick<Organization, 'id' | 'name' | 'timeZone' | 'sprayBufferM'>): StoredSpray {
  return {
    id: spray.id, farmId: spray.farmId, state: spray.state, startsAt: spray.plannedWindow[0].value, endsAt: spray.plannedWindow[1].value,
    appliedAt: spray.appliedAt, ld50UgPerBee: spray.ld50UgPerBee, rt25Hours: spray.rt25Hours, noticedAt: spray.noticedAt,
    productName: spray.productName, epaRegNo: spray.epaRegNo, farm: { id: farm.id, name: farm.name, timeZone: farm.timeZone },
    sprayBufferM: farm.sprayBufferM, blockIds: [...blockIds].sort(),
  };
}

export async function loadStoredSpray(ctx: AppContext, sprayId: string, options: { forUpdate?: boolean; transaction?: Transaction } = {}): Promise<StoredSpray | null> {
  const { SprayPlan, SprayPlanBlock } = ctx.models;
  const { transaction } = options;
  const spray = await SprayPlan.findByPk(sprayId, {
    include: [{ association: 'farm', attributes: ['id', 'name', 'timeZone', 'sprayBufferM'] }],
    transaction,
    ...(options.forUpdate && transaction ? { lock: { level: transaction.LOCK.UPDATE, of: SprayPlan } } : {}),
  });
  if (!spray) return null;
  const links = await SprayPlanBlock.findAll({ where: { sprayPlanId: sprayId }, attributes: ['blockId'], transaction });
  return storedSprayOf(spray, links.map((l) => l.blockId), spray.farm!);
}

export function checkStoredSpray(ctx: AppContext, spray: StoredSpray, transaction?: Transaction): Promise<CheckOutput> {
  const window = sprayWindow({ startsAt: spray.startsAt, endsAt: spray.endsAt, appliedAt: spray.appliedAt });
  return runConflictCheck(ctx.sequelize, {
    farmId: spray.farmId, blockIds: spray.blockIds, ...window, ld50UgPerBee: spray.ld50UgPerBee, rt25Hours: spray.rt25Hours,
    bufferM: spray.sprayBufferM, noticedAt: spray.noticedAt,
  }, transaction);
}

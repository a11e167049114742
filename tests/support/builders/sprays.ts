// Builders for spray plans: planned through the sprays service (so the conflict check runs
// and alerts are raised as in the product), for tests and the demo seed.
import type { AppContext } from '../../../server/src/context.js';
import { toAuthUser } from '../../../server/src/modules/auth/auth-user.js';
import { createSpraysService } from '../../../server/src/modules/sprays/sprays.service.js';
import { sprayInputSchema, type SprayInput } from '../../../shared/schemas/sprays.js';
import { builderModels } from './builder-database.js';

const HOUR_MS = 3_600_000;

/** A spray input with plain defaults: a product without label data, two hours long. */
export function sprayInput(attrs: { blockIds: string[]; startsAt: Date; hours?: number } & Partial<Omit<SprayInput, 'blockIds' | 'startsAt' | 'endsAt'>>) {
  const { startsAt, hours, ...rest } = attrs;
  return {
    productName: 'Orchard Guard 2EC',
    epaRegNo: '1234-56',
    activeIngredients: ['example ingredient'],
    ld50UgPerBee: null,
    rt25Hours: null,
    targetPest: 'Codling moth',
    applicatorName: null,
    notes: null,
    ...rest,
    startsAt: startsAt.toISOString(),
    endsAt: new Date(startsAt.getTime() + (hours ?? 2) * HOUR_MS).toISOString(),
  };
}

async function authUserOf(user: { id: string }) {
  const loaded = await builderModels().User.findByPk(user.id, { include: [{ model: builderModels().Organization, as: 'organization' }] });
  if (!loaded) throw new Error('no such user');
  return toAuthUser(loaded);
}

/** Plans a spray as `by` (a farm member), running the conflict check and raising alerts. */
export async function planSpray(ctx: AppContext, by: { id: string }, input: ReturnType<typeof sprayInput>) {
  return createSpraysService(ctx).create(await authUserOf(by), sprayInputSchema.parse(input));
}

export async function applySpray(ctx: AppContext, by: { id: string }, sprayId: string, appliedAt: Date) {
  return createSpraysService(ctx).apply(await authUserOf(by), sprayId, { appliedAt: appliedAt.toISOString() });
}

export async function cancelSpray(ctx: AppContext, by: { id: string }, sprayId: string) {
  return createSpraysService(ctx).cancel(await authUserOf(by), sprayId);
}

// Durable re-checks: every change that can create or clear a spray conflict calls one of
// these with its own transaction, which writes a re-check job that exists exactly when the
// change is committed. Jobs are keyed (singletonKey `spray:<id>`, `block:<id>`,
// `agreement:<id>` on a 'short' queue), so repeated changes waiting for one spray, block or
// agreement collapse into one job. A block or agreement job finds the sprays it may touch
// and queues one spray job each; a spray job re-checks that spray (alert-recheck.ts).
// Failures are retried with backoff by the queue.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import { spraysNearAgreement, spraysOnBlocks } from '../conflicts/conflicts.queries.js';
import { holdRecheckKey } from './alerts.queries.js';
import { recheckSpray } from './alert-recheck.js';

export type RecheckScope = 'spray' | 'block' | 'agreement';

export interface RecheckJob {
  scope: RecheckScope;
  id: string;
}

async function queueRecheck(ctx: AppContext, transaction: Transaction, scope: RecheckScope, id: string): Promise<void> {
  const key = `${scope}:${id}`;
  // A spray job locks the spray row, which every spray change holds; other scopes use the key.
  if (scope !== 'spray') await holdRecheckKey(ctx.sequelize, transaction, key, 'shared');
  await ctx.jobs.send<RecheckJob>(queueNames.conflictRecheck, { scope, id }, { singletonKey: key, transaction: { sequelize: ctx.sequelize, transaction } });
}

/** A spray was planned, changed, moved, applied or cancelled. */
export const sprayChanged = (ctx: AppContext, transaction: Transaction, sprayId: string) => queueRecheck(ctx, transaction, 'spray', sprayId);

/** A block's bloom window was published or revised. */
export const bloomWindowChanged = (ctx: AppContext, transaction: Transaction, blockId: string) => queueRecheck(ctx, transaction, 'block', blockId);

/** A block's outline or location was redrawn: the conflict check measures from it. */
export const blockPlaceChanged = (ctx: AppContext, transaction: Transaction, blockId: string) => queueRecheck(ctx, transaction, 'block', blockId);

/** An agreement was signed, amended or ended, or one of its placements changed. */
export const agreementChanged = (ctx: AppContext, transaction: Transaction, agreementId: string) => queueRecheck(ctx, transaction, 'agreement', agreementId);

export async function runRecheck(ctx: AppContext, job: RecheckJob): Promise<void> {
  if (job.scope === 'spray') {
    await recheckSpray(ctx, job.id);
    return;
  }
  await ctx.sequelize.transaction(async (transaction) => {
    await holdRecheckKey(ctx.sequelize, transaction, `${job.scope}:${job.id}`, 'exclusive');
    const find = job.scope === 'block' ? spraysOnBlocks(ctx.sequelize, [job.id], ctx.now(), transaction) : spraysNearAgreement(ctx.sequelize, job.id, ctx.now(), transaction);
    for (const sprayId of await find) await sprayChanged(ctx, transaction, sprayId);
  });
}

export async function startConflictRecheckWorker(ctx: AppContext): Promise<void> {
  await ctx.jobs.addWorker<RecheckJob>(queueNames.conflictRecheck, (job) => runRecheck(ctx, job));
}

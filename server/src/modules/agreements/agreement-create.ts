// An accepted commitment becomes an agreement waiting for both sides: the request's terms
// are copied (and the agreed price), with our standard clauses filled in from them.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { agreementClauses } from '../../../../shared/domain/agreement-clauses.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { publish } from '../requests/notify.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';
import type { TimeRange } from '../../db/time-range.js';

const defaultRemovalNoticeHours = 48;

/** A copy of a range value (Sequelize rewrites the array it is given when it writes one). */
export const copyRange = (range: TimeRange): TimeRange => [{ ...range[0] }, { ...range[1] }];

export async function createAgreementForCommitment(ctx: AppContext, commitmentId: string, actorId: string, t: Transaction): Promise<string> {
  const commitment = await ctx.models.Commitment.findByPk(commitmentId, {
    include: [{ model: ctx.models.HiveRequest, as: 'request' }], transaction: t, rejectOnEmpty: true,
  });
  const r = commitment.request!;
  const terms = {
    colonies: commitment.colonies, minFramesOfBees: r.minFramesOfBees, minFramesOfBrood: r.minFramesOfBrood,
    pricePerColonyCents: commitment.proposedPriceCents ?? r.pricePerColonyCents, currency: r.currency.trim(), depositShareBp: r.depositShareBp,
    balanceDueDays: r.balanceDueDays, lateInterestBpPerMonth: r.lateInterestBpPerMonth, belowMinimumRateBp: r.belowMinimumRateBp,
    extraMoveFeeCents: r.extraMoveFeeCents, noticeHours: r.noticeHours, removalNoticeHours: defaultRemovalNoticeHours,
  };
  const agreement = await ctx.models.Agreement.create(
    {
      ...terms, commitmentId, requestId: r.id, farmId: r.farmId, apiaryId: commitment.apiaryId, state: 'awaiting-signatures', currency: r.currency,
      expectedOnSite: copyRange(r.expectedOnSite!), clauses: agreementClauses(terms),
    },
    { transaction: t },
  );
  await recordRequestEvent(ctx, t, r.id, actorId, 'agreement-drafted', { agreementId: agreement.id, commitmentId });
  await agreementChanged(ctx, t, agreement.id); // expected colonies count in the spray conflict check
  return agreement.id;
}

/** Tells both parties an agreement changed. */
export async function announceAgreement(ctx: AppContext, agreementId: string) {
  const a = await ctx.models.Agreement.findByPk(agreementId, { attributes: ['farmId', 'apiaryId', 'requestId', 'state', 'version'] });
  if (a) publish(ctx, [a.farmId, a.apiaryId], 'agreement:updated', { agreementId, requestId: a.requestId, state: a.state, version: a.version });
}

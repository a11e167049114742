// Commitments: a beekeeper offers all or part of the colonies a request still needs. The
// request row is locked (SELECT ... FOR UPDATE) for the whole check-and-insert, so
// concurrent offers are serialised and the total never exceeds the request.
import type { Transaction } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { conflict, notFound, wrongState } from '../../errors/http-errors.js';
import { createError } from '../../errors/create-error.js';
import type { CommitmentBody, CommitmentDto } from '../../../../shared/schemas/requests.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { coloniesOpen, committedColonies, refreshFillState } from '../requests/request-state.js';
import { listCommitments } from '../requests/request-commitments.js';
import { createRequestsService } from '../requests/requests.service.js';
import { mailOrganizations, publish } from '../requests/notify.js';
import { createAgreementForCommitment, announceAgreement } from '../agreements/agreement-create.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';
import { dayIsOver } from '../../../../shared/domain/local-day.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { commitmentStateSet, requestStateSet } from '../../../../shared/labels/requests.js';

const openMessage = (open: number) => (open === 0 ? 'No colonies are still open on this request.' : `Only ${open} ${open === 1 ? 'colony is' : 'colonies are'} still open on this request.`);

export type CommitmentsService = ReturnType<typeof createCommitmentsService>;

export function createCommitmentsService(ctx: AppContext) {

  /** The request row, locked until the transaction ends. */
  function lockRequest(requestId: string, t: Transaction) {
    return ctx.models.HiveRequest.findByPk(requestId, { transaction: t, lock: t.LOCK.UPDATE });
  }

  /** The answer deadline (a calendar day at the farm, in its time zone) is over. */
  async function deadlinePassed(request: { respondBy: string | null; farmId: string }, t: Transaction) {
    if (request.respondBy == null) return false;
    const farm = await ctx.models.Organization.findByPk(request.farmId, { attributes: ['timeZone'], transaction: t });
    return dayIsOver(request.respondBy, ctx.now(), farm?.timeZone ?? 'UTC');
  }

  async function after(commitmentId: string, requestId: string, farmId: string, apiaryId: string, mail: { to: 'farm' | 'apiary'; subject: string; text: string }) {
    const [commitment] = await listCommitments(ctx, { id: commitmentId });
    const open = await coloniesOpen(ctx, requestId);
    publish(ctx, [farmId, apiaryId], 'commitment:updated', { commitmentId, requestId, state: commitment.state, colonies: commitment.colonies });
    await createRequestsService(ctx).announce(requestId, farmId);
    if (commitment.agreementId) await announceAgreement(ctx, commitment.agreementId);
    await mailOrganizations(ctx, [mail.to === 'farm' ? farmId : apiaryId], { subject: mail.subject, text: mail.text });
    return { commitment, coloniesOpen: open.coloniesOpen };
  }

  /** The commitment and its request, locked, for the farm that asked or the apiary that offered; 404 otherwise. */
  async function lockCommitment(user: AuthUser, id: string, side: 'farm' | 'apiary', t: Transaction) {
    const found = await ctx.models.Commitment.findOne({
      attributes: ['requestId'],
      where: side === 'apiary' ? { id, apiaryId: user.organizationId! } : { id },
      include: [{ model: ctx.models.HiveRequest, as: 'request', attributes: [], where: side === 'farm' ? { farmId: user.organizationId! } : undefined }],
      transaction: t,
    });
    if (!found) throw notFound('That commitment');
    const request = (await lockRequest(found.requestId, t))!;
    const commitment = await ctx.models.Commitment.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE, rejectOnEmpty: true });
    return { request, commitment };
  }

  return {
    async offer(user: AuthUser, requestId: string, body: CommitmentBody) {
      const result = await ctx.sequelize.transaction(async (t) => {
        const request = await lockRequest(requestId, t);
        // Visible as in reading a request: open or fully committed, or one the apiary took part in; anything else answers like a missing request.
        const visible = request && (['listed', 'filled'].includes(request.state)
          || (await ctx.models.Commitment.count({ where: { requestId, apiaryId: user.organizationId! }, transaction: t })) > 0);
        if (!request || !visible) throw notFound('That request');
        if (request.state === 'closed' || request.state === 'withdrawn') throw wrongState(`This request is ${labelOf(requestStateSet, request.state).toLowerCase()} and takes no more commitments.`);
        if (await deadlinePassed(request, t)) throw wrongState('The deadline to answer this request has passed.');
        const open = request.coloniesRequested - (await committedColonies(ctx, requestId, t));
        if (body.colonies > open) {
          throw createError('over_committed', `${openMessage(Math.max(0, open))} You offered ${body.colonies}.`, 409, { colonies: `at most ${Math.max(0, open)} still open` });
        }
        const atAskedPrice = body.proposedPriceCents == null || body.proposedPriceCents === request.pricePerColonyCents;
        const now = ctx.now();
        let commitmentId: string;
        try {
          commitmentId = (await ctx.models.Commitment.create(
            {
              requestId, apiaryId: user.organizationId!, colonies: body.colonies, proposedPriceCents: atAskedPrice ? null : body.proposedPriceCents!,
              state: atAskedPrice ? 'accepted' : 'offered', note: body.note ?? null, createdBy: user.id, decidedAt: atAskedPrice ? now : null, createdAt: now,
            },
            { transaction: t },
          )).id;
        } catch (err) {
          if (err instanceof UniqueConstraintError) throw conflict('Your apiary already has an open commitment to this request; withdraw it to offer again.');
          throw err;
        }
        await recordRequestEvent(ctx, t, requestId, user.id, 'commitment-offered', { commitmentId, apiary: user.organizationName, colonies: body.colonies, proposedPriceCents: atAskedPrice ? null : body.proposedPriceCents });
        if (atAskedPrice) await createAgreementForCommitment(ctx, commitmentId, user.id, t);
        await refreshFillState(ctx, requestId, user.id, t);
        return { id: commitmentId, farmId: request.farmId, title: request.title, atAskedPrice };
      });
      return after(result.id, requestId, result.farmId, user.organizationId!, {
        to: 'farm',
        subject: `${user.organizationName} committed ${body.colonies} colonies`,
        text: result.atAskedPrice
          ? `${user.organizationName} committed ${body.colonies} colonies to "${result.title}" at your price. The agreement is ready for both sides to confirm.`
          : `${user.organizationName} offers ${body.colonies} colonies to "${result.title}" at ${(body.proposedPriceCents! / 100).toFixed(2)} per colony. Accept or decline the offer.`,
      });
    },

    async decide(user: AuthUser, id: string, decision: 'accept' | 'decline') {
      const result = await ctx.sequelize.transaction(async (t) => {
        const { request, commitment } = await lockCommitment(user, id, 'farm', t);
        if (commitment.state !== 'offered') throw wrongState(`This commitment is ${labelOf(commitmentStateSet, commitment.state).toLowerCase()}; only an offer at a different price waits for an answer.`);
        if (decision === 'accept' && !['listed', 'filled'].includes(request.state)) throw wrongState(`The request is ${labelOf(requestStateSet, request.state).toLowerCase()}.`);
        await commitment.update({ state: decision === 'accept' ? 'accepted' : 'declined', decidedBy: user.id, decidedAt: ctx.now() }, { transaction: t });
        await recordRequestEvent(ctx, t, request.id, user.id, decision === 'accept' ? 'price-accepted' : 'price-declined', { commitmentId: id, proposedPriceCents: commitment.proposedPriceCents });
        if (decision === 'accept') await createAgreementForCommitment(ctx, id, user.id, t);
        await refreshFillState(ctx, request.id, user.id, t);
        return { request: { id: request.id, farmId: request.farmId, title: request.title }, apiaryId: commitment.apiaryId };
      });
      return after(id, result.request.id, result.request.farmId, result.apiaryId, {
        to: 'apiary',
        subject: `Your offer for "${result.request.title}" was ${decision === 'accept' ? 'accepted' : 'declined'}`,
        text: decision === 'accept' ? 'The grower accepted your price. The agreement is ready for both sides to confirm.' : 'The grower declined your price. The colonies are open again.',
      });
    },

    async withdraw(user: AuthUser, id: string) {
      const result = await ctx.sequelize.transaction(async (t) => {
        const { request, commitment } = await lockCommitment(user, id, 'apiary', t);
        if (!['offered', 'accepted'].includes(commitment.state)) throw wrongState(`This commitment is already ${labelOf(commitmentStateSet, commitment.state).toLowerCase()}.`);
        const agreement = await ctx.models.Agreement.findOne({ attributes: ['id', 'state'], where: { commitmentId: id }, transaction: t, lock: t.LOCK.UPDATE });
        if (agreement && agreement.state !== 'awaiting-signatures') throw wrongState('The agreement for this commitment is confirmed by both sides; change it by amendment instead.');
        if (agreement) {
          await agreement.update({ state: 'cancelled' }, { transaction: t });
          await agreementChanged(ctx, t, agreement.id); // its expected colonies no longer count in the spray conflict check
        }
        await commitment.update({ state: 'withdrawn', decidedBy: user.id, decidedAt: ctx.now() }, { transaction: t });
        await recordRequestEvent(ctx, t, request.id, user.id, 'commitment-withdrawn', { commitmentId: id, colonies: commitment.colonies });
        await refreshFillState(ctx, request.id, user.id, t);
        return { request: { id: request.id, farmId: request.farmId, title: request.title } };
      });
      return after(id, result.request.id, result.request.farmId, user.organizationId!, {
        to: 'farm',
        subject: `${user.organizationName} withdrew a commitment`,
        text: `${user.organizationName} withdrew its commitment to "${result.request.title}". Those colonies are open again.`,
      });
    },

    list: (user: AuthUser): Promise<CommitmentDto[]> => listCommitments(ctx, { apiaryId: user.organizationId! }),
  };
}

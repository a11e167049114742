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
import { execute, selectOne } from '../requests/sql.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { committedColonies, refreshFillState } from '../requests/request-state.js';
import { createRequestsService, listCommitments } from '../requests/requests.service.js';
import { mailOrganizations, publish } from '../requests/notify.js';
import { createAgreementForCommitment, announceAgreement } from '../agreements/agreement-create.js';

type LockedRequest = { id: string; farm_id: string; state: string; colonies_requested: number; price_per_colony_cents: number; respond_by_passed: boolean; title: string };

async function lockRequest(ctx: AppContext, requestId: string, t: Transaction) {
  return selectOne<LockedRequest>(
    ctx,
    `SELECT id, farm_id, state, colonies_requested, price_per_colony_cents, title,
       respond_by IS NOT NULL AND respond_by < (:now::timestamptz)::date AS respond_by_passed
     FROM hive_requests WHERE id = :requestId FOR UPDATE`,
    { requestId, now: ctx.now().toISOString() },
    t,
  );
}

const openMessage = (open: number) => (open === 0 ? 'No colonies are still open on this request.' : `Only ${open} ${open === 1 ? 'colony is' : 'colonies are'} still open on this request.`);

export function createCommitmentsService(ctx: AppContext) {
  async function one(id: string): Promise<CommitmentDto> {
    const row = await selectOne<{ request_id: string }>(ctx, 'SELECT request_id FROM commitments WHERE id = :id', { id });
    return (await listCommitments(ctx, { requestId: row!.request_id })).find((c) => c.id === id)!;
  }

  async function after(commitmentId: string, requestId: string, farmId: string, apiaryId: string, mail: { to: 'farm' | 'apiary'; subject: string; text: string }) {
    const commitment = await one(commitmentId);
    const request = (await selectOne<{ state: string; colonies_requested: number }>(ctx, 'SELECT state, colonies_requested FROM hive_requests WHERE id = :requestId', { requestId }))!;
    const coloniesOpen = Math.max(0, request.colonies_requested - (await committedColonies(ctx, requestId)));
    publish(ctx, [farmId, apiaryId], 'commitment:updated', { commitmentId, requestId, state: commitment.state, colonies: commitment.colonies });
    await createRequestsService(ctx).announce(requestId, farmId);
    if (commitment.agreementId) await announceAgreement(ctx, commitment.agreementId);
    await mailOrganizations(ctx, [mail.to === 'farm' ? farmId : apiaryId], { subject: mail.subject, text: mail.text });
    return { commitment, coloniesOpen };
  }

  /** The commitment and its request, locked, for the farm that asked or the apiary that offered; 404 otherwise. */
  async function lockCommitment(user: AuthUser, id: string, side: 'farm' | 'apiary', t: Transaction) {
    const found = await selectOne<{ request_id: string }>(
      ctx,
      `SELECT c.request_id FROM commitments c JOIN hive_requests r ON r.id = c.request_id
       WHERE c.id = :id AND ${side === 'farm' ? 'r.farm_id' : 'c.apiary_id'} = :org`,
      { id, org: user.organizationId },
      t,
    );
    if (!found) throw notFound('That commitment');
    const request = (await lockRequest(ctx, found.request_id, t))!;
    const commitment = (await selectOne<{ id: string; apiary_id: string; colonies: number; proposed_price_cents: number | null; state: string }>(
      ctx, 'SELECT id, apiary_id, colonies, proposed_price_cents, state FROM commitments WHERE id = :id FOR UPDATE', { id }, t,
    ))!;
    return { request, commitment };
  }

  return {
    async offer(user: AuthUser, requestId: string, body: CommitmentBody) {
      const result = await ctx.sequelize.transaction(async (t) => {
        const request = await lockRequest(ctx, requestId, t);
        const visible = request && (['listed', 'filled'].includes(request.state) || Boolean(await selectOne(ctx, 'SELECT 1 FROM commitments WHERE request_id = :requestId AND apiary_id = :org', { requestId, org: user.organizationId }, t)));
        if (!request || !visible) throw notFound('That request');
        if (request.state === 'closed' || request.state === 'withdrawn') throw wrongState(`This request is ${request.state} and takes no more commitments.`);
        if (request.respond_by_passed) throw wrongState('The deadline to answer this request has passed.');
        const open = request.colonies_requested - (await committedColonies(ctx, requestId, t));
        if (body.colonies > open) {
          throw createError('over_committed', `${openMessage(Math.max(0, open))} You offered ${body.colonies}.`, 409, { colonies: `at most ${Math.max(0, open)} still open` });
        }
        const atAskedPrice = body.proposedPriceCents == null || body.proposedPriceCents === request.price_per_colony_cents;
        const state = atAskedPrice ? 'accepted' : 'offered';
        let row: { id: string };
        try {
          row = (await selectOne<{ id: string }>(
            ctx,
            `INSERT INTO commitments (request_id, apiary_id, colonies, proposed_price_cents, state, note, created_by, decided_at, created_at, updated_at)
             VALUES (:requestId, :org, :colonies, :price, :state, :note, :userId, :decidedAt, :now, :now) RETURNING id`,
            {
              requestId, org: user.organizationId, colonies: body.colonies, price: atAskedPrice ? null : body.proposedPriceCents, state, note: body.note ?? null,
              userId: user.id, decidedAt: atAskedPrice ? ctx.now().toISOString() : null, now: ctx.now().toISOString(),
            },
            t,
          ))!;
        } catch (err) {
          if (err instanceof UniqueConstraintError) throw conflict('Your apiary already has an open commitment to this request; withdraw it to offer again.');
          throw err;
        }
        await recordRequestEvent(ctx, t, requestId, user.id, 'commitment-offered', { commitmentId: row.id, apiary: user.organizationName, colonies: body.colonies, proposedPriceCents: atAskedPrice ? null : body.proposedPriceCents });
        if (atAskedPrice) await createAgreementForCommitment(ctx, row.id, user.id, t);
        await refreshFillState(ctx, requestId, user.id, t);
        return { id: row.id, farmId: request.farm_id, title: request.title, atAskedPrice };
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
        if (commitment.state !== 'offered') throw wrongState(`This commitment is ${commitment.state}; only an offer at a different price waits for an answer.`);
        if (decision === 'accept' && !['listed', 'filled'].includes(request.state)) throw wrongState(`The request is ${request.state}.`);
        await execute(ctx, 'UPDATE commitments SET state = :state, decided_by = :userId, decided_at = :now, updated_at = now() WHERE id = :id', { id, state: decision === 'accept' ? 'accepted' : 'declined', userId: user.id, now: ctx.now().toISOString() }, t);
        await recordRequestEvent(ctx, t, request.id, user.id, decision === 'accept' ? 'price-accepted' : 'price-declined', { commitmentId: id, proposedPriceCents: commitment.proposed_price_cents });
        if (decision === 'accept') await createAgreementForCommitment(ctx, id, user.id, t);
        await refreshFillState(ctx, request.id, user.id, t);
        return { request, apiaryId: commitment.apiary_id };
      });
      return after(id, result.request.id, result.request.farm_id, result.apiaryId, {
        to: 'apiary',
        subject: `Your offer for "${result.request.title}" was ${decision === 'accept' ? 'accepted' : 'declined'}`,
        text: decision === 'accept' ? 'The grower accepted your price. The agreement is ready for both sides to confirm.' : 'The grower declined your price. The colonies are open again.',
      });
    },

    async withdraw(user: AuthUser, id: string) {
      const result = await ctx.sequelize.transaction(async (t) => {
        const { request, commitment } = await lockCommitment(user, id, 'apiary', t);
        if (!['offered', 'accepted'].includes(commitment.state)) throw wrongState(`This commitment is already ${commitment.state}.`);
        const agreement = await selectOne<{ id: string; state: string }>(ctx, 'SELECT id, state FROM agreements WHERE commitment_id = :id FOR UPDATE', { id }, t);
        if (agreement && agreement.state !== 'awaiting-signatures') throw wrongState('The agreement for this commitment is confirmed by both sides; change it by amendment instead.');
        if (agreement) await execute(ctx, "UPDATE agreements SET state = 'cancelled', updated_at = now() WHERE id = :agreementId", { agreementId: agreement.id }, t);
        await execute(ctx, "UPDATE commitments SET state = 'withdrawn', decided_by = :userId, decided_at = :now, updated_at = now() WHERE id = :id", { id, userId: user.id, now: ctx.now().toISOString() }, t);
        await recordRequestEvent(ctx, t, request.id, user.id, 'commitment-withdrawn', { commitmentId: id, colonies: commitment.colonies });
        await refreshFillState(ctx, request.id, user.id, t);
        return { request };
      });
      return after(id, result.request.id, result.request.farm_id, user.organizationId!, {
        to: 'farm',
        subject: `${user.organizationName} withdrew a commitment`,
        text: `${user.organizationName} withdrew its commitment to "${result.request.title}". Those colonies are open again.`,
      });
    },

    list: (user: AuthUser) => listCommitments(ctx, { apiaryId: user.organizationId! }),
  };
}

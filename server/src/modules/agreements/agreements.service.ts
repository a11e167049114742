// Agreements: both sides confirm (who, when); then the terms are fixed and placements are
// scheduled. A change afterwards is an amendment one side proposes and the other confirms.
import type { Transaction } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { Agreement } from '../../db/models/agreement.model.js';
import { conflict, forbidden, notFound, wrongState } from '../../errors/http-errors.js';
import { rangeBounds, timeRange } from '../../db/time-range.js';
import { agreementClauses } from '../../../../shared/domain/agreement-clauses.js';
import type { AgreementDto, AmendmentBody, AmendmentChanges } from '../../../../shared/schemas/agreements.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { mailOrganizations } from '../requests/notify.js';
import { announceAgreement, copyRange } from './agreement-create.js';
import { createPlacementsForAgreement } from '../placements/placement-create.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { agreementStateSet, amendmentStateSet } from '../../../../shared/labels/agreements.js';

/** Amendable terms (besides the window), by their attribute names. */
const amendableTerms = ['pricePerColonyCents', 'noticeHours', 'removalNoticeHours', 'minFramesOfBees', 'extraMoveFeeCents'] as const satisfies ReadonlyArray<Exclude<keyof AmendmentChanges, 'expectedOnSite'>>;

export function sideOf(user: AuthUser): 'farm' | 'apiary' {
  if (user.organizationKind !== 'farm' && user.organizationKind !== 'apiary') throw forbidden();
  return user.organizationKind;
}

export type AgreementsService = ReturnType<typeof createAgreementsService>;

export function createAgreementsService(ctx: AppContext) {

  /** Everything an agreement's answer shows: parties, who confirmed, the request's blocks, the amendments. */
  const fullAgreement = () => ({
    include: [
      {
        model: ctx.models.HiveRequest, as: 'request', attributes: ['id', 'title'],
        include: [{ model: ctx.models.HiveRequestBlock, as: 'blockShares', include: [{ model: ctx.models.Block, as: 'block', attributes: ['id', 'name', 'crop'] }] }],
      },
      { model: ctx.models.Organization, as: 'farm', attributes: ['name'] },
      { model: ctx.models.Organization, as: 'apiary', attributes: ['name'] },
      { model: ctx.models.User, as: 'farmConfirmer', attributes: ['name'] },
      { model: ctx.models.User, as: 'apiaryConfirmer', attributes: ['name'] },
      {
        model: ctx.models.AgreementAmendment, as: 'amendments',
        include: [{ model: ctx.models.User, as: 'proposer', attributes: ['name'] }, { model: ctx.models.User, as: 'decider', attributes: ['name'] }],
      },
    ],
    order: [
      [{ model: ctx.models.HiveRequest, as: 'request' }, { model: ctx.models.HiveRequestBlock, as: 'blockShares' }, { model: ctx.models.Block, as: 'block' }, 'name', 'ASC'],
      [{ model: ctx.models.AgreementAmendment, as: 'amendments' }, 'createdAt', 'ASC'],
      [{ model: ctx.models.AgreementAmendment, as: 'amendments' }, 'id', 'ASC'],
    ] as never,
  });

  function toDto(a: Agreement): AgreementDto {
    const window = rangeBounds(a.expectedOnSite)!;
    return {
      id: a.id, requestId: a.requestId, requestTitle: a.request!.title, commitmentId: a.commitmentId, farmId: a.farmId, farmName: a.farm!.name,
      apiaryId: a.apiaryId, apiaryName: a.apiary!.name, state: a.state, version: a.version, colonies: a.colonies,
      pricePerColonyCents: a.pricePerColonyCents, currency: a.currency.trim(), minFramesOfBees: a.minFramesOfBees, minFramesOfBrood: a.minFramesOfBrood,
      expectedOnSite: { from: window.from!, to: window.to! }, noticeHours: a.noticeHours, removalNoticeHours: a.removalNoticeHours,
      depositShareBp: a.depositShareBp, balanceDueDays: a.balanceDueDays, lateInterestBpPerMonth: a.lateInterestBpPerMonth,
      belowMinimumRateBp: a.belowMinimumRateBp, extraMoveFeeCents: a.extraMoveFeeCents, clauses: a.clauses,
      blocks: a.request!.blockShares!.map((s) => ({ id: s.block!.id, name: s.block!.name, crop: s.block!.crop })),
      farmConfirmation: { byName: a.farmConfirmer?.name ?? null, at: a.farmConfirmedAt?.toISOString() ?? null },
      apiaryConfirmation: { byName: a.apiaryConfirmer?.name ?? null, at: a.apiaryConfirmedAt?.toISOString() ?? null },
      amendments: a.amendments!.map((x) => ({
        id: x.id, state: x.state, changes: x.changes, previous: x.previousTerms, reason: x.reason, proposedSide: x.proposedSide,
        proposedByName: x.proposer?.name ?? null, decidedByName: x.decider?.name ?? null, decidedAt: x.decidedAt?.toISOString() ?? null,
        versionAfter: x.versionAfter, createdAt: x.createdAt.toISOString(),
      })),
      createdAt: a.createdAt.toISOString(),
    };
  }

  /** The agreement row locked for a change by one of its parties; 404 for anyone else. */
  async function lockOwn(user: AuthUser, id: string, t: Transaction) {
    const row = await ctx.models.Agreement.scope({ method: ['ofParty', user.organizationId] }).findOne({ where: { id }, transaction: t, lock: t.LOCK.UPDATE });
    if (!row) throw notFound('That agreement');
    return row;
  }

  const service = {
    async list(user: AuthUser): Promise<AgreementDto[]> {
      const rows = await ctx.models.Agreement.scope({ method: ['ofParty', user.organizationId] }).findAll(fullAgreement());
      const start = (a: Agreement) => a.expectedOnSite[0].value?.getTime() ?? -Infinity;
      rows.sort((a, b) => start(a) - start(b) || a.createdAt.getTime() - b.createdAt.getTime() || (a.id < b.id ? -1 : 1));
      return rows.map(toDto);
    },

    async get(user: AuthUser, id: string): Promise<AgreementDto> {
      const row = await ctx.models.Agreement.scope({ method: ['ofParty', user.organizationId] }).findOne({ where: { id }, ...fullAgreement() });
      if (!row) throw notFound('That agreement');
      return toDto(row);
    },

    async confirm(user: AuthUser, id: string): Promise<AgreementDto> {
      const side = sideOf(user);
      const result = await ctx.sequelize.transaction(async (t) => {
        const a = await lockOwn(user, id, t);
        if (a.state !== 'awaiting-signatures') throw wrongState(`This agreement is ${labelOf(agreementStateSet, a.state).toLowerCase()}; there is nothing to confirm.`);
        if ((side === 'farm' ? a.farmConfirmedAt : a.apiaryConfirmedAt) != null) throw conflict('Your side has already confirmed this agreement.');
        const bothConfirmed = (side === 'farm' ? a.apiaryConfirmedAt : a.farmConfirmedAt) != null;
        const now = ctx.now();
        await a.update(side === 'farm' ? { farmConfirmedBy: user.id, farmConfirmedAt: now } : { apiaryConfirmedBy: user.id, apiaryConfirmedAt: now }, { transaction: t });
        await recordRequestEvent(ctx, t, a.requestId, user.id, 'agreement-confirmed', { agreementId: id, side });
        if (bothConfirmed) {
          await a.update({ state: 'in-force' }, { transaction: t });
          const created = await createPlacementsForAgreement(ctx, id, t);
          await recordRequestEvent(ctx, t, a.requestId, user.id, 'agreement-in-force', { agreementId: id, placements: created.length });
          await agreementChanged(ctx, t, id); // the spray conflict check grades agreements in force
        }
        return { farmId: a.farmId, apiaryId: a.apiaryId, bothConfirmed };
      });
      await announceAgreement(ctx, id);
      const other = side === 'farm' ? result.apiaryId : result.farmId;
      await mailOrganizations(ctx, [other], {
        subject: result.bothConfirmed ? 'Agreement confirmed by both sides' : `${user.organizationName} confirmed the agreement`,
        text: result.bothConfirmed
          ? `${user.organizationName} confirmed the pollination agreement; it is now fixed and the drop-offs are scheduled.`
          : `${user.organizationName} confirmed the pollination agreement. Please review and confirm it too.`,
      });
      return service.get(user, id);
    },

    async proposeAmendment(user: AuthUser, id: string, body: AmendmentBody): Promise<AgreementDto> {
      const side = sideOf(user);
      const a = await ctx.sequelize.transaction(async (t) => {
        const a = await lockOwn(user, id, t);
        if (a.state !== 'in-force') throw wrongState(`Only an agreement confirmed by both sides is amended; this one is ${labelOf(agreementStateSet, a.state).toLowerCase()}.`);
        const now = ctx.now();
        try {
          await ctx.models.AgreementAmendment.create(
            { agreementId: id, changes: body.changes as AmendmentChanges, reason: body.reason, proposedSide: side, proposedBy: user.id, createdAt: now },
            { transaction: t },
          );
        } catch (err) {
          if (err instanceof UniqueConstraintError) throw conflict('An amendment to this agreement is already waiting for an answer.');
          throw err;
        }
        await recordRequestEvent(ctx, t, a.requestId, user.id, 'amendment-proposed', { agreementId: id, changes: body.changes });
        return { farmId: a.farmId, apiaryId: a.apiaryId };
      });
      await announceAgreement(ctx, id);
      await mailOrganizations(ctx, [side === 'farm' ? a.apiaryId : a.farmId], { subject: 'An amendment to your agreement waits for you', text: `${user.organizationName} proposes a change: ${body.reason}` });
      return service.get(user, id);
    },

    async answerAmendment(user: AuthUser, id: string, amendmentId: string, answer: 'confirm' | 'reject' | 'withdraw'): Promise<AgreementDto> {
      const side = sideOf(user);
      const outcome = await ctx.sequelize.transaction(async (t) => {
        const a = await lockOwn(user, id, t);
        const amendment = await ctx.models.AgreementAmendment.findOne({ where: { id: amendmentId, agreementId: id }, transaction: t, lock: t.LOCK.UPDATE });
        if (!amendment) throw notFound('That amendment');
        if (amendment.state !== 'proposed') throw wrongState(`This change to the agreement is already ${labelOf(amendmentStateSet, amendment.state).toLowerCase()}.`);
        const own = amendment.proposedSide === side;
        if (answer === 'withdraw' && !own) throw forbidden('Only the side that proposed an amendment may withdraw it.');
        if (answer !== 'withdraw' && own) throw forbidden('The other side confirms or rejects an amendment your side proposed.');
        if (answer === 'confirm' && a.state !== 'in-force') throw wrongState(`This agreement is ${labelOf(agreementStateSet, a.state).toLowerCase()}.`);
        let versionAfter: number | null = null;
        const previous: Record<string, unknown> = {};
        if (answer === 'confirm') {
          const changes = amendment.changes;
          const next: Partial<Pick<Agreement, (typeof amendableTerms)[number] | 'expectedOnSite'>> = {};
          for (const key of amendableTerms) {
            if (changes[key] === undefined) continue;
            previous[key] = a[key];
            next[key] = changes[key];
          }
          if (changes.expectedOnSite) {
            previous.expectedOnSite = rangeBounds(a.expectedOnSite);
            next.expectedOnSite = timeRange(changes.expectedOnSite.from, changes.expectedOnSite.to);
          }
          versionAfter = a.version + 1;
          await a.update({ ...next, version: versionAfter }, { transaction: t });
          await a.update({
            clauses: agreementClauses({
              colonies: a.colonies, minFramesOfBees: a.minFramesOfBees, minFramesOfBrood: a.minFramesOfBrood, pricePerColonyCents: a.pricePerColonyCents,
              currency: a.currency.trim(), depositShareBp: a.depositShareBp, balanceDueDays: a.balanceDueDays, lateInterestBpPerMonth: a.lateInterestBpPerMonth,
              belowMinimumRateBp: a.belowMinimumRateBp, extraMoveFeeCents: a.extraMoveFeeCents, noticeHours: a.noticeHours, removalNoticeHours: a.removalNoticeHours,
            }),
          }, { transaction: t });
          // Placements not yet delivered follow the agreement's window.
          await ctx.models.Placement.update({ onSite: copyRange(a.expectedOnSite) }, { where: { agreementId: id, state: 'scheduled' }, transaction: t });
        }
        const state = answer === 'confirm' ? 'accepted' : answer === 'reject' ? 'rejected' : 'withdrawn';
        await amendment.update({ state, decidedBy: user.id, decidedAt: ctx.now(), previousTerms: previous, versionAfter }, { transaction: t });
        await recordRequestEvent(ctx, t, a.requestId, user.id, `amendment-${state}`, { agreementId: id, amendmentId });
        if (state === 'accepted') await agreementChanged(ctx, t, id);
        return { farmId: a.farmId, apiaryId: a.apiaryId, state };
      });
      await announceAgreement(ctx, id);
      await mailOrganizations(ctx, [side === 'farm' ? outcome.apiaryId : outcome.farmId], { subject: `Change to the agreement: ${labelOf(amendmentStateSet, outcome.state).toLowerCase()}`, text: `${user.organizationName} ${outcome.state === 'accepted' ? 'accepted' : outcome.state === 'rejected' ? 'turned down' : 'withdrew'} the change to your pollination agreement.` });
      return service.get(user, id);
    },
  };
  return service;
}

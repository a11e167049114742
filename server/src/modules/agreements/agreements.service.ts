// Agreements: both sides confirm (who, when); then the terms are fixed and placements are
// scheduled. A change afterwards is an amendment one side proposes and the other confirms.
import type { Transaction } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { conflict, forbidden, notFound, wrongState } from '../../errors/http-errors.js';
import { agreementClauses, type AgreementClause } from '../../../../shared/domain/agreement-clauses.js';
import type { AgreementDto, AgreementState, AmendmentBody, AmendmentChanges, AmendmentDto } from '../../../../shared/schemas/agreements.js';
import { execute, iso, parseRange, selectOne, selectRows } from '../requests/sql.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { mailOrganizations } from '../requests/notify.js';
import { announceAgreement } from './agreement-create.js';
import { createPlacementsForAgreement } from '../placements/placement-create.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';

type AgreementRow = {
  id: string; request_id: string; request_title: string; commitment_id: string; farm_id: string; farm_name: string; apiary_id: string; apiary_name: string;
  state: AgreementState; version: number; colonies: number; price_per_colony_cents: number; currency: string; min_frames_of_bees: number;
  min_frames_of_brood: number | null; expected_on_site: string; notice_hours: number; removal_notice_hours: number; deposit_share_bp: number;
  balance_due_days: number; late_interest_bp_per_month: number; below_minimum_rate_bp: number; extra_move_fee_cents: number; clauses: AgreementClause[];
  farm_confirmed_name: string | null; farm_confirmed_at: Date | null; apiary_confirmed_name: string | null; apiary_confirmed_at: Date | null; created_at: Date;
};

const selectAgreements = `
  SELECT a.*, a.expected_on_site::text AS expected_on_site, r.title AS request_title, fo.name AS farm_name, ao.name AS apiary_name,
    fu.name AS farm_confirmed_name, au.name AS apiary_confirmed_name
  FROM agreements a JOIN hive_requests r ON r.id = a.request_id JOIN organizations fo ON fo.id = a.farm_id JOIN organizations ao ON ao.id = a.apiary_id
  LEFT JOIN users fu ON fu.id = a.farm_confirmed_by LEFT JOIN users au ON au.id = a.apiary_confirmed_by`;

/** Amendable terms and their columns. */
const amendableColumns: Record<Exclude<keyof AmendmentChanges, 'expectedOnSite'>, string> = {
  pricePerColonyCents: 'price_per_colony_cents',
  noticeHours: 'notice_hours',
  removalNoticeHours: 'removal_notice_hours',
  minFramesOfBees: 'min_frames_of_bees',
  extraMoveFeeCents: 'extra_move_fee_cents',
};

export function sideOf(user: AuthUser): 'farm' | 'apiary' {
  if (user.organizationKind !== 'farm' && user.organizationKind !== 'apiary') throw forbidden();
  return user.organizationKind;
}

export function createAgreementsService(ctx: AppContext) {
  async function amendmentsOf(agreementId: string): Promise<AmendmentDto[]> {
    const rows = await selectRows<{ id: string; state: AmendmentDto['state']; changes: AmendmentChanges; previous: Record<string, unknown>; reason: string; proposed_side: 'farm' | 'apiary'; proposed_name: string | null; decided_name: string | null; decided_at: Date | null; version_after: number | null; created_at: Date }>(
      ctx,
      `SELECT m.*, pu.name AS proposed_name, du.name AS decided_name FROM agreement_amendments m
       LEFT JOIN users pu ON pu.id = m.proposed_by LEFT JOIN users du ON du.id = m.decided_by WHERE m.agreement_id = :agreementId ORDER BY m.created_at, m.id`,
      { agreementId },
    );
    return rows.map((m) => ({
      id: m.id, state: m.state, changes: m.changes, previous: m.previous, reason: m.reason, proposedSide: m.proposed_side, proposedByName: m.proposed_name,
      decidedByName: m.decided_name, decidedAt: iso(m.decided_at), versionAfter: m.version_after, createdAt: iso(m.created_at)!,
    }));
  }

  async function toDto(row: AgreementRow): Promise<AgreementDto> {
    const window = parseRange(row.expected_on_site)!;
    const blocks = await selectRows<{ id: string; name: string; crop: string }>(
      ctx, 'SELECT b.id, b.name, b.crop FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = :requestId ORDER BY b.name', { requestId: row.request_id },
    );
    return {
      id: row.id, requestId: row.request_id, requestTitle: row.request_title, commitmentId: row.commitment_id, farmId: row.farm_id, farmName: row.farm_name,
      apiaryId: row.apiary_id, apiaryName: row.apiary_name, state: row.state, version: row.version, colonies: row.colonies,
      pricePerColonyCents: row.price_per_colony_cents, currency: row.currency.trim(), minFramesOfBees: row.min_frames_of_bees, minFramesOfBrood: row.min_frames_of_brood,
      expectedOnSite: { from: window.from!, to: window.to! }, noticeHours: row.notice_hours, removalNoticeHours: row.removal_notice_hours,
      depositShareBp: row.deposit_share_bp, balanceDueDays: row.balance_due_days, lateInterestBpPerMonth: row.late_interest_bp_per_month,
      belowMinimumRateBp: row.below_minimum_rate_bp, extraMoveFeeCents: row.extra_move_fee_cents, clauses: row.clauses, blocks,
      farmConfirmation: { byName: row.farm_confirmed_name, at: iso(row.farm_confirmed_at) },
      apiaryConfirmation: { byName: row.apiary_confirmed_name, at: iso(row.apiary_confirmed_at) },
      amendments: await amendmentsOf(row.id), createdAt: iso(row.created_at)!,
    };
  }

  /** The agreement row locked for a change by one of its parties; 404 for anyone else. */
  async function lockOwn(user: AuthUser, id: string, t: Transaction) {
    const row = await selectOne<{ id: string; state: AgreementState; farm_id: string; apiary_id: string; request_id: string; farm_confirmed_at: Date | null; apiary_confirmed_at: Date | null; version: number }>(
      ctx, 'SELECT id, state, farm_id, apiary_id, request_id, farm_confirmed_at, apiary_confirmed_at, version FROM agreements WHERE id = :id AND (farm_id = :org OR apiary_id = :org) FOR UPDATE',
      { id, org: user.organizationId }, t,
    );
    if (!row) throw notFound('That agreement');
    return row;
  }

  const service = {
    async list(user: AuthUser): Promise<AgreementDto[]> {
      const rows = await selectRows<AgreementRow>(ctx, `${selectAgreements} WHERE a.farm_id = :org OR a.apiary_id = :org ORDER BY lower(a.expected_on_site), a.created_at, a.id`, { org: user.organizationId });
      return Promise.all(rows.map(toDto));
    },

    async get(user: AuthUser, id: string): Promise<AgreementDto> {
      const row = await selectOne<AgreementRow>(ctx, `${selectAgreements} WHERE a.id = :id AND (a.farm_id = :org OR a.apiary_id = :org)`, { id, org: user.organizationId });
      if (!row) throw notFound('That agreement');
      return toDto(row);
    },

    async confirm(user: AuthUser, id: string): Promise<AgreementDto> {
      const side = sideOf(user);
      const result = await ctx.sequelize.transaction(async (t) => {
        const a = await lockOwn(user, id, t);
        if (a.state !== 'awaiting-signatures') throw wrongState(`This agreement is ${a.state}; there is nothing to confirm.`);
        if ((side === 'farm' ? a.farm_confirmed_at : a.apiary_confirmed_at) != null) throw conflict('Your side has already confirmed this agreement.');
        const now = ctx.now().toISOString();
        await execute(ctx, `UPDATE agreements SET ${side}_confirmed_by = :userId, ${side}_confirmed_at = :now, updated_at = now() WHERE id = :id`, { id, userId: user.id, now }, t);
        const bothConfirmed = (side === 'farm' ? a.apiary_confirmed_at : a.farm_confirmed_at) != null;
        await recordRequestEvent(ctx, t, a.request_id, user.id, 'agreement-confirmed', { agreementId: id, side });
        let created: string[] = [];
        if (bothConfirmed) {
          await execute(ctx, "UPDATE agreements SET state = 'in-force', updated_at = now() WHERE id = :id", { id }, t);
          created = await createPlacementsForAgreement(ctx, id, t);
          await recordRequestEvent(ctx, t, a.request_id, user.id, 'agreement-in-force', { agreementId: id, placements: created.length });
          await agreementChanged(ctx, t, id); // the spray conflict check grades agreements in force
        }
        return { a, created, bothConfirmed };
      });
      await announceAgreement(ctx, id);
      const other = side === 'farm' ? result.a.apiary_id : result.a.farm_id;
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
        if (a.state !== 'in-force') throw wrongState(`Only an agreement confirmed by both sides is amended; this one is ${a.state}.`);
        try {
          await execute(
            ctx,
            `INSERT INTO agreement_amendments (agreement_id, changes, reason, proposed_side, proposed_by, created_at, updated_at)
             VALUES (:id, :changes::jsonb, :reason, :side, :userId, :now, :now)`,
            { id, changes: JSON.stringify(body.changes), reason: body.reason, side, userId: user.id, now: ctx.now().toISOString() },
            t,
          );
        } catch (err) {
          if (err instanceof UniqueConstraintError) throw conflict('An amendment to this agreement is already waiting for an answer.');
          throw err;
        }
        await recordRequestEvent(ctx, t, a.request_id, user.id, 'amendment-proposed', { agreementId: id, changes: body.changes });
        return a;
      });
      await announceAgreement(ctx, id);
      await mailOrganizations(ctx, [side === 'farm' ? a.apiary_id : a.farm_id], { subject: 'An amendment to your agreement waits for you', text: `${user.organizationName} proposes a change: ${body.reason}` });
      return service.get(user, id);
    },

    async answerAmendment(user: AuthUser, id: string, amendmentId: string, answer: 'confirm' | 'reject' | 'withdraw'): Promise<AgreementDto> {
      const side = sideOf(user);
      const outcome = await ctx.sequelize.transaction(async (t) => {
        const a = await lockOwn(user, id, t);
        const m = await selectOne<{ id: string; state: string; proposed_side: string; changes: AmendmentChanges }>(
          ctx, 'SELECT id, state, proposed_side, changes FROM agreement_amendments WHERE id = :amendmentId AND agreement_id = :id FOR UPDATE', { amendmentId, id }, t,
        );
        if (!m) throw notFound('That amendment');
        if (m.state !== 'proposed') throw wrongState(`This amendment is already ${m.state}.`);
        const own = m.proposed_side === side;
        if (answer === 'withdraw' && !own) throw forbidden('Only the side that proposed an amendment may withdraw it.');
        if (answer !== 'withdraw' && own) throw forbidden('The other side confirms or rejects an amendment your side proposed.');
        if (answer === 'confirm' && a.state !== 'in-force') throw wrongState(`This agreement is ${a.state}.`);
        const now = ctx.now().toISOString();
        let versionAfter: number | null = null;
        let previous: Record<string, unknown> = {};
        if (answer === 'confirm') {
          const current = (await selectOne<Record<string, unknown>>(ctx, 'SELECT *, expected_on_site::text AS expected_on_site FROM agreements WHERE id = :id', { id }, t))!;
          const sets: string[] = [];
          const replacements: Record<string, unknown> = { id };
          for (const [key, column] of Object.entries(amendableColumns)) {
            const value = m.changes[key as keyof typeof amendableColumns];
            if (value === undefined) continue;
            previous[key] = current[column];
            sets.push(`${column} = :${key}`);
            replacements[key] = value;
          }
          if (m.changes.expectedOnSite) {
            previous.expectedOnSite = parseRange(current.expected_on_site as string);
            sets.push("expected_on_site = tstzrange(:from, :to, '[)')");
            replacements.from = m.changes.expectedOnSite.from;
            replacements.to = m.changes.expectedOnSite.to;
          }
          versionAfter = a.version + 1;
          await execute(ctx, `UPDATE agreements SET ${sets.join(', ')}, version = ${versionAfter}, updated_at = now() WHERE id = :id`, replacements, t);
          const terms = (await selectOne<Record<string, number | string | null>>(ctx, 'SELECT * FROM agreements WHERE id = :id', { id }, t))!;
          const clauses = agreementClauses({
            colonies: terms.colonies as number, minFramesOfBees: terms.min_frames_of_bees as number, minFramesOfBrood: terms.min_frames_of_brood as number | null,
            pricePerColonyCents: terms.price_per_colony_cents as number, currency: String(terms.currency).trim(), depositShareBp: terms.deposit_share_bp as number,
            balanceDueDays: terms.balance_due_days as number, lateInterestBpPerMonth: terms.late_interest_bp_per_month as number,
            belowMinimumRateBp: terms.below_minimum_rate_bp as number, extraMoveFeeCents: terms.extra_move_fee_cents as number,
            noticeHours: terms.notice_hours as number, removalNoticeHours: terms.removal_notice_hours as number,
          });
          await execute(ctx, 'UPDATE agreements SET clauses = :clauses::jsonb WHERE id = :id', { id, clauses: JSON.stringify(clauses) }, t);
          // Placements not yet delivered follow the agreement's window.
          await execute(ctx, "UPDATE placements SET on_site = a.expected_on_site, updated_at = now() FROM agreements a WHERE a.id = placements.agreement_id AND placements.agreement_id = :id AND placements.state = 'scheduled'", { id }, t);
        }
        const state = answer === 'confirm' ? 'accepted' : answer === 'reject' ? 'rejected' : 'withdrawn';
        await execute(
          ctx,
          'UPDATE agreement_amendments SET state = :state, decided_by = :userId, decided_at = :now, previous = :previous::jsonb, version_after = :versionAfter, updated_at = now() WHERE id = :amendmentId',
          { state, userId: user.id, now, previous: JSON.stringify(previous), versionAfter, amendmentId },
          t,
        );
        await recordRequestEvent(ctx, t, a.request_id, user.id, `amendment-${state}`, { agreementId: id, amendmentId });
        if (state === 'accepted') await agreementChanged(ctx, t, id);
        return { a, state };
      });
      await announceAgreement(ctx, id);
      await mailOrganizations(ctx, [side === 'farm' ? outcome.a.apiary_id : outcome.a.farm_id], { subject: `Amendment ${outcome.state}`, text: `${user.organizationName} ${outcome.state === 'accepted' ? 'confirmed' : outcome.state} the amendment to your pollination agreement.` });
      return service.get(user, id);
    },
  };
  return service;
}

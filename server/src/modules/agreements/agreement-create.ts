// An accepted commitment becomes an agreement waiting for both sides: the request's terms
// are copied (and the agreed price), with our standard clauses filled in from them.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { agreementClauses } from '../../../../shared/domain/agreement-clauses.js';
import { selectOne } from '../requests/sql.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { publish } from '../requests/notify.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';

const defaultRemovalNoticeHours = 48;

export async function createAgreementForCommitment(ctx: AppContext, commitmentId: string, actorId: string, t: Transaction): Promise<string> {
  const terms = (await selectOne<{
    request_id: string; farm_id: string; apiary_id: string; colonies: number; price: number; currency: string; min_bees: number; min_brood: number | null;
    window: string; notice_hours: number; deposit_share_bp: number; balance_due_days: number; late_interest_bp_per_month: number;
    below_minimum_rate_bp: number; extra_move_fee_cents: number;
  }>(
    ctx,
    `SELECT r.id AS request_id, r.farm_id, c.apiary_id, c.colonies, coalesce(c.proposed_price_cents, r.price_per_colony_cents) AS price, r.currency,
       r.min_frames_of_bees AS min_bees, r.min_frames_of_brood AS min_brood, r.expected_on_site::text AS window, r.notice_hours, r.deposit_share_bp,
       r.balance_due_days, r.late_interest_bp_per_month, r.below_minimum_rate_bp, r.extra_move_fee_cents
     FROM commitments c JOIN hive_requests r ON r.id = c.request_id WHERE c.id = :commitmentId`,
    { commitmentId },
    t,
  ))!;
  const clauses = agreementClauses({
    colonies: terms.colonies, minFramesOfBees: terms.min_bees, minFramesOfBrood: terms.min_brood, pricePerColonyCents: terms.price,
    currency: terms.currency.trim(), depositShareBp: terms.deposit_share_bp, balanceDueDays: terms.balance_due_days,
    lateInterestBpPerMonth: terms.late_interest_bp_per_month, belowMinimumRateBp: terms.below_minimum_rate_bp,
    extraMoveFeeCents: terms.extra_move_fee_cents, noticeHours: terms.notice_hours, removalNoticeHours: defaultRemovalNoticeHours,
  });
  const row = (await selectOne<{ id: string }>(
    ctx,
    `INSERT INTO agreements (commitment_id, request_id, farm_id, apiary_id, state, colonies, price_per_colony_cents, currency, min_frames_of_bees,
       min_frames_of_brood, expected_on_site, notice_hours, removal_notice_hours, deposit_share_bp, balance_due_days, late_interest_bp_per_month,
       below_minimum_rate_bp, extra_move_fee_cents, clauses)
     VALUES (:commitmentId, :requestId, :farmId, :apiaryId, 'awaiting-signatures', :colonies, :price, :currency, :minBees, :minBrood, :window::tstzrange,
       :notice, :removal, :deposit, :balanceDays, :interest, :belowMin, :moveFee, :clauses::jsonb)
     RETURNING id`,
    {
      commitmentId, requestId: terms.request_id, farmId: terms.farm_id, apiaryId: terms.apiary_id, colonies: terms.colonies, price: terms.price,
      currency: terms.currency, minBees: terms.min_bees, minBrood: terms.min_brood, window: terms.window, notice: terms.notice_hours,
      removal: defaultRemovalNoticeHours, deposit: terms.deposit_share_bp, balanceDays: terms.balance_due_days, interest: terms.late_interest_bp_per_month,
      belowMin: terms.below_minimum_rate_bp, moveFee: terms.extra_move_fee_cents, clauses: JSON.stringify(clauses),
    },
    t,
  ))!;
  await recordRequestEvent(ctx, t, terms.request_id, actorId, 'agreement-drafted', { agreementId: row.id, commitmentId });
  await agreementChanged(ctx, t, row.id); // expected colonies count in the spray conflict check
  return row.id;
}

/** Tells both parties an agreement changed. */
export async function announceAgreement(ctx: AppContext, agreementId: string) {
  const a = await selectOne<{ farm_id: string; apiary_id: string; request_id: string; state: string; version: number }>(
    ctx, 'SELECT farm_id, apiary_id, request_id, state, version FROM agreements WHERE id = :agreementId', { agreementId },
  );
  if (a) publish(ctx, [a.farm_id, a.apiary_id], 'agreement:updated', { agreementId, requestId: a.request_id, state: a.state, version: a.version });
}

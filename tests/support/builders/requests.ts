// Builders for the hive request flow: a small market (a farm with a block in bloom, two
// apiaries with yards, people of each role), request payloads as the client sends them,
// and the finishing touches the core builders leave out (clauses, one-sided confirmation,
// audit entries).
import { QueryTypes } from 'sequelize';
import { agreementClauses } from '../../../shared/domain/agreement-clauses.js';
import { buildOrganization, buildUser } from './accounts.js';
import { buildBlock, buildBloomWindow, buildYard } from './season.js';
import type { RequestBody } from '../../../shared/schemas/requests.js';
import { builderSequelize } from './builder-database.js';

let counter = 0;

/** A farm whose apple block is in bloom around `bloomStart`, and two apiary businesses with a yard each. */
export async function buildMarket(attrs: { bloomStart?: string; fullBloom?: string; petalFall?: string; lon?: number; lat?: number } = {}) {
  const tag = `${Date.now().toString(36)}${(counter++).toString(36)}`;
  const lon = attrs.lon ?? -120.5;
  const lat = attrs.lat ?? 46.6;
  const farm = await buildOrganization({ kind: 'farm', name: `Quillfern Orchard ${tag}` });
  const otherFarm = await buildOrganization({ kind: 'farm', name: `Tamsel Farm ${tag}` });
  const apiary = await buildOrganization({ kind: 'apiary', name: `Wickmoor Apiary ${tag}` });
  const apiary2 = await buildOrganization({ kind: 'apiary', name: `Hollin Bees ${tag}` });
  const people = {
    grower: await buildUser({ organization: farm, role: 'owner', email: `grower-${tag}@example.test`, name: 'Gale Orrin' }),
    farmViewer: await buildUser({ organization: farm, role: 'viewer', email: `farm-viewer-${tag}@example.test` }),
    otherGrower: await buildUser({ organization: otherFarm, role: 'owner', email: `other-grower-${tag}@example.test` }),
    keeper: await buildUser({ organization: apiary, role: 'owner', email: `keeper-${tag}@example.test`, name: 'Bram Tully' }),
    crew: await buildUser({ organization: apiary, role: 'crew', email: `crew-${tag}@example.test`, name: 'Nell Ashby' }),
    apiaryViewer: await buildUser({ organization: apiary, role: 'viewer', email: `apiary-viewer-${tag}@example.test` }),
    keeper2: await buildUser({ organization: apiary2, role: 'owner', email: `keeper2-${tag}@example.test`, name: 'Ivo Pell' }),
  };
  const block = await buildBlock({ farm, name: `North Galas ${tag}`, crop: 'apple', lon, lat, acres: 30, coloniesPerAcre: 2 });
  await buildBloomWindow({ block, bloomStart: attrs.bloomStart ?? '2027-04-10', fullBloom: attrs.fullBloom ?? '2027-04-20', petalFall: attrs.petalFall ?? '2027-04-30' });
  // Yards due east of the block on the same parallel: about 0.1 degrees of longitude apart.
  const yard = await buildYard({ apiary, name: 'Creekside yard', lon: lon + 0.1, lat });
  const yard2 = await buildYard({ apiary: apiary2, name: 'Ridge yard', lon: lon + 0.5, lat });
  return { farm, otherFarm, apiary, apiary2, people, block, yard, yard2, lon, lat };
}

export function requestPayload(blockId: string, overrides: Partial<RequestBody> = {}, site: { lon: number; lat: number } = { lon: -120.5, lat: 46.6 }): RequestBody {
  return {
    title: 'Galas at first bloom',
    blocks: [{ blockId, colonies: 60 }],
    minFramesOfBees: 6,
    minFramesOfBrood: null,
    arrive: { rule: 'bloom-stage', bloomPercent: 5 },
    depart: { rule: 'petal-fall' },
    pricePerColonyCents: 7000,
    depositShareBp: 5000,
    balanceDueDays: 30,
    lateInterestBpPerMonth: 100,
    noticeHours: 48,
    dropSites: [
      { blockId, name: 'North lane', location: { type: 'Point', coordinates: [site.lon, site.lat] }, coloniesPlanned: 36, gateCode: '4471', vehicleAccess: 'Flatbed to the lane end', waterSource: 'Trough at the pump' },
      { blockId, name: 'South gate', location: { type: 'Point', coordinates: [site.lon, site.lat - 0.002] }, coloniesPlanned: 24 },
    ],
    ...overrides,
  };
}

/** Writes our standard clauses into an agreement made by buildAgreement, from its own terms. */
export async function fillAgreementClauses(agreement: { id: string }) {
  const sequelize = builderSequelize();
  const [t] = await sequelize.query<Record<string, number | string | null>>('SELECT * FROM agreements WHERE id = :id', { replacements: { id: agreement.id }, type: QueryTypes.SELECT });
  const clauses = agreementClauses({
    colonies: t.colonies as number, minFramesOfBees: t.min_frames_of_bees as number, minFramesOfBrood: t.min_frames_of_brood as number | null,
    pricePerColonyCents: t.price_per_colony_cents as number, currency: String(t.currency).trim(), depositShareBp: t.deposit_share_bp as number,
    balanceDueDays: t.balance_due_days as number, lateInterestBpPerMonth: t.late_interest_bp_per_month as number, belowMinimumRateBp: t.below_minimum_rate_bp as number,
    extraMoveFeeCents: t.extra_move_fee_cents as number, noticeHours: t.notice_hours as number, removalNoticeHours: t.removal_notice_hours as number,
  });
  await sequelize.query('UPDATE agreements SET clauses = :clauses::jsonb WHERE id = :id', { replacements: { id: agreement.id, clauses: JSON.stringify(clauses) } });
}

/** Records who confirmed an agreement for one side, and when. */
export async function confirmAgreementSide(agreement: { id: string }, side: 'farm' | 'apiary', by: { id: string }, at: Date) {
  await builderSequelize().query(`UPDATE agreements SET ${side}_confirmed_by = :by, ${side}_confirmed_at = :at WHERE id = :id`, {
    replacements: { id: agreement.id, by: by.id, at: at.toISOString() },
  });
}

/**
 * Dates an agreement made by buildAgreement (made and confirmed now) as made at `at`, and
 * the confirmations it has as given two and five hours later: the farm's, then the apiary's.
 */
export async function agreementSignedAt(agreement: { id: string }, at: Date) {
  const hours = (n: number) => new Date(at.getTime() + n * 3_600_000).toISOString();
  await builderSequelize().query(
    `UPDATE agreements SET created_at = :at,
       farm_confirmed_at = CASE WHEN farm_confirmed_at IS NULL THEN NULL ELSE :farmAt::timestamptz END,
       apiary_confirmed_at = CASE WHEN apiary_confirmed_at IS NULL THEN NULL ELSE :apiaryAt::timestamptz END
     WHERE id = :id`,
    { replacements: { id: agreement.id, at: at.toISOString(), farmAt: hours(2), apiaryAt: hours(5) } },
  );
}

/** Says an agreement was made at `at` (an earlier time), so field steps recorded since then are not before it. */
export async function agreementMadeAt(agreement: { id: string }, at: Date) {
  await builderSequelize().query('UPDATE agreements SET created_at = :at WHERE id = :id', { replacements: { id: agreement.id, at: at.toISOString() } });
}

/** An audit-trail entry on a request. */
export async function buildRequestEvent(request: { id: string }, actor: { id: string } | null, action: string, at: Date, detail: Record<string, unknown> = {}) {
  await builderSequelize().query(
    'INSERT INTO hive_request_events (request_id, actor_id, action, detail, created_at) VALUES (:requestId, :actorId, :action, :detail::jsonb, :at)',
    { replacements: { requestId: request.id, actorId: actor?.id ?? null, action, detail: JSON.stringify(detail), at: at.toISOString() } },
  );
}

// Hive requests: a grower asks for colonies on blocks, with strength, dates, terms and
// drop sites; beekeepers see the open ones with the distance from their nearest yard.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { expectedOnSite, WindowError, type BloomWindowDates } from '../../../../shared/domain/request-window.js';
import type {
  CommitmentDto, DropSiteDto, OpenRequestsQuery, ParsedRequestBody, RequestDetailDto, RequestEventDto, RequestState, RequestSummaryDto,
} from '../../../../shared/schemas/requests.js';
import { execute, iso, parseRange, selectOne, selectRows } from './sql.js';
import { recordRequestEvent } from './request-events.js';
import { committedColonies } from './request-state.js';
import { mailOrganizations, publish } from './notify.js';

type SummaryRow = {
  id: string; farm_id: string; farm_name: string; title: string; state: RequestState; colonies_requested: number; committed: string;
  crops: string[] | null; min_frames_of_bees: number; min_frames_of_brood: number | null; expected_on_site: string | null;
  price_per_colony_cents: number; currency: string; respond_by: string | null; distance_km: number | null;
};

const summaryColumns = (apiaryParam: string | null) => `
  r.id, r.farm_id, o.name AS farm_name, r.title, r.state, r.colonies_requested,
  (SELECT coalesce(sum(c.colonies), 0) FROM commitments c WHERE c.request_id = r.id AND c.state IN ('offered', 'accepted')) AS committed,
  (SELECT array_agg(DISTINCT b.crop ORDER BY b.crop) FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id) AS crops,
  r.min_frames_of_bees, r.min_frames_of_brood, r.expected_on_site::text AS expected_on_site, r.price_per_colony_cents, r.currency,
  to_char(r.respond_by, 'YYYY-MM-DD') AS respond_by,
  ${
    apiaryParam
      ? `(SELECT min(ST_Distance(y.location::geography, t.geom::geography)) / 1000
          FROM yards y CROSS JOIN (
            SELECT d.location AS geom FROM drop_sites d WHERE d.request_id = r.id
            UNION ALL
            SELECT coalesce(b.location, ST_Centroid(b.outline)) FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id
          ) t WHERE y.apiary_id = ${apiaryParam} AND t.geom IS NOT NULL)`
      : 'NULL::double precision'
  } AS distance_km`;

function toSummary(row: SummaryRow): RequestSummaryDto {
  const committed = Number(row.committed);
  const range = parseRange(row.expected_on_site);
  return {
    id: row.id, farmId: row.farm_id, farmName: row.farm_name, title: row.title, state: row.state,
    coloniesRequested: row.colonies_requested, coloniesCommitted: committed, coloniesOpen: Math.max(0, row.colonies_requested - committed),
    crops: row.crops ?? [], minFramesOfBees: row.min_frames_of_bees, minFramesOfBrood: row.min_frames_of_brood,
    expectedOnSite: range?.from && range.to ? { from: range.from, to: range.to } : null,
    pricePerColonyCents: row.price_per_colony_cents, currency: row.currency, respondBy: row.respond_by,
    distanceKm: row.distance_km == null ? null : Math.round(row.distance_km * 10) / 10,
  };
}

/** Requests a beekeeper may see: open ones, and any it has committed to. */
const apiaryVisible = `(r.state IN ('listed', 'filled') OR EXISTS (SELECT 1 FROM commitments c WHERE c.request_id = r.id AND c.apiary_id = :org))`;

export function createRequestsService(ctx: AppContext) {
  async function bloomWindowsFor(blockIds: string[], t?: Transaction): Promise<BloomWindowDates[]> {
    const rows = await selectRows<{ bloom_start: string; full_bloom: string | null; petal_fall: string }>(
      ctx,
      `SELECT DISTINCT ON (block_id) to_char(bloom_start, 'YYYY-MM-DD') AS bloom_start, to_char(full_bloom, 'YYYY-MM-DD') AS full_bloom,
         to_char(petal_fall, 'YYYY-MM-DD') AS petal_fall
       FROM current_bloom_windows WHERE block_id IN (:blockIds) ORDER BY block_id, season DESC`,
      { blockIds },
      t,
    );
    return rows.map((r) => ({ bloomStart: r.bloom_start, fullBloom: r.full_bloom, petalFall: r.petal_fall }));
  }

  async function checkBlocks(user: AuthUser, body: ParsedRequestBody, t: Transaction) {
    const blockIds = body.blocks.map((b) => b.blockId);
    const owned = await selectRows<{ id: string }>(ctx, 'SELECT id FROM blocks WHERE id IN (:blockIds) AND farm_id = :org', { blockIds, org: user.organizationId }, t);
    const ownedIds = new Set(owned.map((b) => b.id));
    const fields: Record<string, string> = {};
    body.blocks.forEach((b, i) => { if (!ownedIds.has(b.blockId)) fields[`blocks.${i}.blockId`] = 'is not one of your blocks'; });
    body.dropSites.forEach((d, i) => { if (!blockIds.includes(d.blockId)) fields[`dropSites.${i}.blockId`] = 'must be one of the blocks of this request'; });
    if (Object.keys(fields).length) throw badRequest(`Please check: ${Object.keys(fields).join(', ')}.`, fields);
    const timeZone = (await selectOne<{ time_zone: string }>(ctx, 'SELECT time_zone FROM organizations WHERE id = :org', { org: user.organizationId }, t))!.time_zone;
    try {
      return expectedOnSite({ arrive: body.arrive, depart: body.depart, bloomWindows: await bloomWindowsFor(blockIds, t), timeZone });
    } catch (err) {
      if (err instanceof WindowError) throw badRequest(`Please check: ${err.field}.`, { [err.field]: err.message });
      throw err;
    }
  }

  async function writeParts(requestId: string, body: ParsedRequestBody, t: Transaction) {
    for (const b of body.blocks) {
      await execute(ctx, 'INSERT INTO hive_request_blocks (request_id, block_id, colonies) VALUES (:requestId, :blockId, :colonies)', { requestId, blockId: b.blockId, colonies: b.colonies }, t);
    }
    for (const d of body.dropSites) {
      await execute(
        ctx,
        `INSERT INTO drop_sites (request_id, block_id, name, location, colonies_planned, access_notes, vehicle_access, gate_code, water_source)
         VALUES (:requestId, :blockId, :name, ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326), :colonies, :accessNotes, :vehicleAccess, :gateCode, :waterSource)`,
        {
          requestId, blockId: d.blockId, name: d.name, location: JSON.stringify(d.location), colonies: d.coloniesPlanned,
          accessNotes: d.accessNotes ?? null, vehicleAccess: d.vehicleAccess ?? null, gateCode: d.gateCode ?? null, waterSource: d.waterSource ?? null,
        },
        t,
      );
    }
  }

  function termsReplacements(body: ParsedRequestBody, window: { from: Date; to: Date }) {
    return {
      title: body.title, colonies: body.blocks.reduce((s, b) => s + b.colonies, 0), minBees: body.minFramesOfBees, minBrood: body.minFramesOfBrood ?? null,
      arriveRule: body.arrive.rule, arrivePercent: body.arrive.rule === 'bloom-stage' ? body.arrive.bloomPercent : null,
      arriveOn: body.arrive.rule === 'date' ? body.arrive.on : null, departRule: body.depart.rule, departOn: body.depart.rule === 'date' ? body.depart.on : null,
      from: window.from.toISOString(), to: window.to.toISOString(), price: body.pricePerColonyCents, currency: body.currency,
      deposit: body.depositShareBp, balanceDays: body.balanceDueDays, interest: body.lateInterestBpPerMonth, belowMin: body.belowMinimumRateBp,
      moveFee: body.extraMoveFeeCents, notice: body.noticeHours, respondBy: body.respondBy ?? null, notes: body.notes ?? null,
    };
  }

  /** The request row locked for a change by its farm; 404 for anyone else's. */
  async function lockOwn(user: AuthUser, id: string, t: Transaction) {
    const row = await selectOne<{ id: string; state: RequestState; colonies_requested: number; title: string }>(
      ctx, 'SELECT id, state, colonies_requested, title FROM hive_requests WHERE id = :id AND farm_id = :org FOR UPDATE', { id, org: user.organizationId }, t,
    );
    if (!row) throw notFound('That request');
    return row;
  }

  async function announce(requestId: string, farmId: string) {
    const row = (await selectOne<{ state: string; colonies_requested: number }>(ctx, 'SELECT state, colonies_requested FROM hive_requests WHERE id = :requestId', { requestId }))!;
    const coloniesOpen = Math.max(0, row.colonies_requested - (await committedColonies(ctx, requestId)));
    const apiaries = await selectRows<{ id: string }>(ctx, "SELECT id FROM organizations WHERE kind = 'apiary'");
    publish(ctx, [farmId, ...apiaries.map((a) => a.id)], 'request:updated', { requestId, state: row.state, coloniesOpen });
  }

  const service = {
    announce,

    async create(user: AuthUser, body: ParsedRequestBody): Promise<RequestDetailDto> {
      const id = await ctx.sequelize.transaction(async (t) => {
        const window = await checkBlocks(user, body, t);
        const row = (await selectOne<{ id: string }>(
          ctx,
          `INSERT INTO hive_requests (farm_id, title, state, colonies_requested, min_frames_of_bees, min_frames_of_brood, arrive_rule, arrive_bloom_percent,
             arrive_on, depart_rule, depart_on, expected_on_site, price_per_colony_cents, currency, deposit_share_bp, balance_due_days,
             late_interest_bp_per_month, below_minimum_rate_bp, extra_move_fee_cents, notice_hours, respond_by, notes, created_by)
           VALUES (:org, :title, 'draft', :colonies, :minBees, :minBrood, :arriveRule, :arrivePercent, :arriveOn, :departRule, :departOn,
             tstzrange(:from, :to, '[)'), :price, :currency, :deposit, :balanceDays, :interest, :belowMin, :moveFee, :notice, :respondBy, :notes, :userId)
           RETURNING id`,
          { org: user.organizationId, userId: user.id, ...termsReplacements(body, window) },
          t,
        ))!;
        await writeParts(row.id, body, t);
        await recordRequestEvent(ctx, t, row.id, user.id, 'created', { colonies: body.blocks.reduce((s, b) => s + b.colonies, 0) });
        return row.id;
      });
      return service.get(user, id);
    },

    async update(user: AuthUser, id: string, body: ParsedRequestBody): Promise<RequestDetailDto> {
      await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['draft', 'listed'].includes(current.state)) throw wrongState(`A request that is ${current.state} can no longer be edited.`);
        if ((await committedColonies(ctx, id, t)) > 0) throw wrongState('Beekeepers have committed colonies to this request; it can no longer be edited. Withdraw it and ask again instead.');
        const window = await checkBlocks(user, body, t);
        await execute(
          ctx,
          `UPDATE hive_requests SET title = :title, colonies_requested = :colonies, min_frames_of_bees = :minBees, min_frames_of_brood = :minBrood,
             arrive_rule = :arriveRule, arrive_bloom_percent = :arrivePercent, arrive_on = :arriveOn, depart_rule = :departRule, depart_on = :departOn,
             expected_on_site = tstzrange(:from, :to, '[)'), price_per_colony_cents = :price, currency = :currency, deposit_share_bp = :deposit,
             balance_due_days = :balanceDays, late_interest_bp_per_month = :interest, below_minimum_rate_bp = :belowMin, extra_move_fee_cents = :moveFee,
             notice_hours = :notice, respond_by = :respondBy, notes = :notes, updated_at = now()
           WHERE id = :id`,
          { id, ...termsReplacements(body, window) },
          t,
        );
        await execute(ctx, 'DELETE FROM drop_sites WHERE request_id = :id; DELETE FROM hive_request_blocks WHERE request_id = :id', { id }, t);
        await writeParts(id, body, t);
        await recordRequestEvent(ctx, t, id, user.id, 'edited', {});
      });
      const detail = await service.get(user, id);
      if (detail.state === 'listed') await announce(id, detail.farmId);
      return detail;
    },

    async publish(user: AuthUser, id: string): Promise<RequestDetailDto> {
      await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (current.state !== 'draft') throw wrongState(`Only a draft can be opened for commitments; this request is ${current.state}.`);
        const sites = await selectOne<{ n: string }>(ctx, 'SELECT count(*) AS n FROM drop_sites WHERE request_id = :id', { id }, t);
        if (Number(sites!.n) === 0) throw badRequest('Add at least one drop site before opening the request.', { dropSites: 'add at least one drop site first' });
        const late = await selectOne<{ late: boolean }>(ctx, 'SELECT respond_by IS NOT NULL AND respond_by < (:now::timestamptz AT TIME ZONE (SELECT o.time_zone FROM organizations o WHERE o.id = hive_requests.farm_id))::date AS late FROM hive_requests WHERE id = :id', { id, now: ctx.now().toISOString() }, t);
        if (late!.late) throw badRequest('The answer deadline has passed; set a later one first.', { respondBy: 'is in the past' });
        await execute(ctx, "UPDATE hive_requests SET state = 'listed', updated_at = now() WHERE id = :id", { id }, t);
        await recordRequestEvent(ctx, t, id, user.id, 'opened', {});
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      const apiaries = await selectRows<{ id: string }>(ctx, "SELECT id FROM organizations WHERE kind = 'apiary'");
      await mailOrganizations(ctx, apiaries.map((a) => a.id), {
        subject: `New hive request: ${detail.title}`,
        text: `${detail.farmName} asks for ${detail.coloniesRequested} colonies (${detail.crops.join(', ')}), at least ${detail.minFramesOfBees} frames of bees.`,
      });
      return detail;
    },

    async withdraw(user: AuthUser, id: string): Promise<RequestDetailDto> {
      const affected = await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['draft', 'listed', 'filled'].includes(current.state)) throw wrongState(`A request that is ${current.state} cannot be withdrawn.`);
        const signed = await selectOne<{ n: string }>(ctx, "SELECT count(*) AS n FROM agreements WHERE request_id = :id AND state IN ('in-force', 'completed')", { id }, t);
        if (Number(signed!.n) > 0) throw wrongState('An agreement for this request is confirmed by both sides; change it by amendment instead of withdrawing the request.');
        const apiaries = await selectRows<{ apiary_id: string }>(ctx, "SELECT DISTINCT apiary_id FROM commitments WHERE request_id = :id AND state IN ('offered', 'accepted')", { id }, t);
        await execute(ctx, "UPDATE agreements SET state = 'cancelled', updated_at = now() WHERE request_id = :id AND state = 'awaiting-signatures'", { id }, t);
        await execute(ctx, "UPDATE commitments SET state = 'withdrawn', decided_by = :userId, decided_at = :now, updated_at = now() WHERE request_id = :id AND state IN ('offered', 'accepted')", { id, userId: user.id, now: ctx.now().toISOString() }, t);
        await execute(ctx, "UPDATE hive_requests SET state = 'withdrawn', updated_at = now() WHERE id = :id", { id }, t);
        await recordRequestEvent(ctx, t, id, user.id, 'withdrawn', {});
        return { apiaryIds: apiaries.map((a) => a.apiary_id), title: current.title };
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      await mailOrganizations(ctx, affected.apiaryIds, { subject: `Request withdrawn: ${affected.title}`, text: `${detail.farmName} withdrew the request "${affected.title}". Your commitment to it is released.` });
      return detail;
    },

    async close(user: AuthUser, id: string): Promise<RequestDetailDto> {
      await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['listed', 'filled'].includes(current.state)) throw wrongState(`Only an open or fully committed request can be closed; this one is ${current.state}.`);
        await execute(ctx, "UPDATE commitments SET state = 'declined', decided_by = :userId, decided_at = :now, updated_at = now() WHERE request_id = :id AND state = 'offered'", { id, userId: user.id, now: ctx.now().toISOString() }, t);
        await execute(ctx, "UPDATE hive_requests SET state = 'closed', updated_at = now() WHERE id = :id", { id }, t);
        await recordRequestEvent(ctx, t, id, user.id, 'closed', {});
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      return detail;
    },

    async list(user: AuthUser, query: OpenRequestsQuery): Promise<RequestSummaryDto[]> {
      const isApiary = user.organizationKind === 'apiary';
      const where = [isApiary ? apiaryVisible : 'r.farm_id = :org'];
      if (query.crop) where.push('EXISTS (SELECT 1 FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id AND b.crop = :crop)');
      if (query.from) where.push("r.expected_on_site && tstzrange(:from::date::timestamptz, NULL)");
      if (query.to) where.push("r.expected_on_site && tstzrange(NULL, (:to::date + 1)::timestamptz)");
      const rows = await selectRows<SummaryRow>(
        ctx,
        `SELECT * FROM (SELECT ${summaryColumns(isApiary ? ':org' : null)} FROM hive_requests r JOIN organizations o ON o.id = r.farm_id WHERE ${where.join(' AND ')}) q
         ${isApiary && query.maxDistanceKm ? 'WHERE q.distance_km <= :maxDistanceKm' : ''}
         ORDER BY ${isApiary ? 'q.distance_km NULLS LAST,' : ''} lower(q.expected_on_site::tstzrange) NULLS LAST, q.title, q.id`,
        { org: user.organizationId, crop: query.crop ?? null, from: query.from ?? null, to: query.to ?? null, maxDistanceKm: query.maxDistanceKm ?? null },
      );
      return rows.map(toSummary);
    },

    async get(user: AuthUser, id: string): Promise<RequestDetailDto> {
      const isApiary = user.organizationKind === 'apiary';
      const row = await selectOne<SummaryRow & {
        arrive_rule: 'bloom-stage' | 'date'; arrive_bloom_percent: number | null; arrive_on: string | null; depart_rule: 'petal-fall' | 'date';
        depart_on: string | null; deposit_share_bp: number; balance_due_days: number; late_interest_bp_per_month: number; below_minimum_rate_bp: number;
        extra_move_fee_cents: number; notice_hours: number; notes: string | null;
      }>(
        ctx,
        `SELECT ${summaryColumns(isApiary ? ':org' : null)}, r.arrive_rule, r.arrive_bloom_percent, to_char(r.arrive_on, 'YYYY-MM-DD') AS arrive_on,
           r.depart_rule, to_char(r.depart_on, 'YYYY-MM-DD') AS depart_on, r.deposit_share_bp, r.balance_due_days, r.late_interest_bp_per_month,
           r.below_minimum_rate_bp, r.extra_move_fee_cents, r.notice_hours, r.notes
         FROM hive_requests r JOIN organizations o ON o.id = r.farm_id
         WHERE r.id = :id AND ${isApiary ? apiaryVisible : 'r.farm_id = :org'}`,
        { id, org: user.organizationId },
      );
      if (!row) throw notFound('That request');
      const blocks = await selectRows<{ block_id: string; name: string; crop: string; acres: number; colonies: number; bloom_start: string | null; full_bloom: string | null; petal_fall: string | null }>(
        ctx,
        `SELECT hb.block_id, b.name, b.crop, b.area_m2 / 4046.8564224 AS acres, hb.colonies,
           to_char(w.bloom_start, 'YYYY-MM-DD') AS bloom_start, to_char(w.full_bloom, 'YYYY-MM-DD') AS full_bloom, to_char(w.petal_fall, 'YYYY-MM-DD') AS petal_fall
         FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id
         LEFT JOIN LATERAL (SELECT * FROM current_bloom_windows cw WHERE cw.block_id = b.id ORDER BY season DESC LIMIT 1) w ON true
         WHERE hb.request_id = :id ORDER BY b.name`,
        { id },
      );
      // The gate code stays with the grower until an agreement with this apiary is confirmed by both sides.
      const signed = isApiary
        ? Boolean(await selectOne(ctx, "SELECT 1 FROM agreements WHERE request_id = :id AND apiary_id = :org AND state IN ('in-force', 'completed')", { id, org: user.organizationId }))
        : true;
      const sites = await selectRows<{ id: string; block_id: string; name: string; location: string; colonies_planned: number; access_notes: string | null; vehicle_access: string | null; water_source: string | null; gate_code: string | null }>(
        ctx,
        'SELECT id, block_id, name, ST_AsGeoJSON(location) AS location, colonies_planned, access_notes, vehicle_access, water_source, gate_code FROM drop_sites WHERE request_id = :id ORDER BY created_at, name, id',
        { id },
      );
      const dropSites: DropSiteDto[] = sites.map((s) => ({
        id: s.id, blockId: s.block_id, name: s.name, location: JSON.parse(s.location), coloniesPlanned: s.colonies_planned, accessNotes: s.access_notes,
        vehicleAccess: s.vehicle_access, waterSource: s.water_source, gateCode: signed ? s.gate_code : null, gateCodeHidden: !signed && s.gate_code != null,
      }));
      const commitments = await listCommitments(ctx, isApiary ? { requestId: id, apiaryId: user.organizationId! } : { requestId: id });
      const events: RequestEventDto[] = isApiary
        ? []
        : (
            await selectRows<{ id: string; action: string; actor_name: string | null; detail: Record<string, unknown>; created_at: Date }>(
              ctx,
              'SELECT e.id, e.action, u.name AS actor_name, e.detail, e.created_at FROM hive_request_events e LEFT JOIN users u ON u.id = e.actor_id WHERE e.request_id = :id ORDER BY e.id',
              { id },
            )
          ).map((e) => ({ id: String(e.id), action: e.action, actorName: e.actor_name, detail: e.detail, at: iso(e.created_at)! }));
      return {
        ...toSummary(row),
        arrive: row.arrive_rule === 'bloom-stage' ? { rule: 'bloom-stage', bloomPercent: row.arrive_bloom_percent ?? 0 } : { rule: 'date', on: row.arrive_on! },
        depart: row.depart_rule === 'petal-fall' ? { rule: 'petal-fall' } : { rule: 'date', on: row.depart_on! },
        depositShareBp: row.deposit_share_bp, balanceDueDays: row.balance_due_days, lateInterestBpPerMonth: row.late_interest_bp_per_month,
        belowMinimumRateBp: row.below_minimum_rate_bp, extraMoveFeeCents: row.extra_move_fee_cents, noticeHours: row.notice_hours, notes: row.notes,
        blocks: blocks.map((b) => ({
          blockId: b.block_id, name: b.name, crop: b.crop, acres: Math.round(b.acres * 100) / 100, colonies: b.colonies,
          bloomWindow: b.bloom_start ? { bloomStart: b.bloom_start, fullBloom: b.full_bloom, petalFall: b.petal_fall! } : null,
        })),
        dropSites,
        commitments,
        events,
      };
    },
  };
  return service;
}

export async function listCommitments(ctx: AppContext, where: { requestId?: string; apiaryId?: string }): Promise<CommitmentDto[]> {
  const clauses = ['true'];
  if (where.requestId) clauses.push('c.request_id = :requestId');
  if (where.apiaryId) clauses.push('c.apiary_id = :apiaryId');
  const rows = await selectRows<{ id: string; request_id: string; apiary_id: string; apiary_name: string; colonies: number; proposed_price_cents: number | null; state: CommitmentDto['state']; note: string | null; agreement_id: string | null; created_at: Date }>(
    ctx,
    `SELECT c.id, c.request_id, c.apiary_id, o.name AS apiary_name, c.colonies, c.proposed_price_cents, c.state, c.note, a.id AS agreement_id, c.created_at
     FROM commitments c JOIN organizations o ON o.id = c.apiary_id LEFT JOIN agreements a ON a.commitment_id = c.id
     WHERE ${clauses.join(' AND ')} ORDER BY c.created_at, c.id`,
    { requestId: where.requestId ?? null, apiaryId: where.apiaryId ?? null },
  );
  return rows.map((r) => ({
    id: r.id, requestId: r.request_id, apiaryId: r.apiary_id, apiaryName: r.apiary_name, colonies: r.colonies, proposedPriceCents: r.proposed_price_cents,
    state: r.state, note: r.note, agreementId: r.agreement_id, createdAt: iso(r.created_at)!,
  }));
}

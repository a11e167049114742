// Hive requests: a grower asks for colonies on blocks, with strength, dates, terms and
// drop sites; beekeepers see the open ones with the distance from their nearest yard.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { BloomWindow } from '../../db/models/bloom-window.model.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { timeRange } from '../../db/time-range.js';
import { plainGeoJson } from '../../db/geojson.js';
import { expectedOnSite, WindowError } from '../../../../shared/domain/request-window.js';
import type {
  DropSiteDto, OpenRequestsQuery, ParsedRequestBody, RequestDetailDto, RequestEventDto, RequestSummaryDto,
} from '../../../../shared/schemas/requests.js';
import { requestSummaries, type RequestSummaryRow } from './requests.queries.js';
import { recordRequestEvent } from './request-events.js';
import { coloniesOpen, committedColonies } from './request-state.js';
import { listCommitments } from './request-commitments.js';
import { apiaryIds, mailOrganizations, publish } from './notify.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';
import { dayIsOver } from '../../../../shared/domain/local-day.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { requestStateSet } from '../../../../shared/labels/requests.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';

const squareMetresPerAcre = 4046.8564224;

function toSummary(row: RequestSummaryRow): RequestSummaryDto {
  return {
    id: row.id, farmId: row.farm_id, farmName: row.farm_name, title: row.title, state: row.state,
    coloniesRequested: row.colonies_requested, coloniesCommitted: row.committed, coloniesOpen: Math.max(0, row.colonies_requested - row.committed),
    crops: row.crops ?? [], minFramesOfBees: row.min_frames_of_bees, minFramesOfBrood: row.min_frames_of_brood,
    expectedOnSite: row.on_site_from && row.on_site_to ? { from: row.on_site_from.toISOString(), to: row.on_site_to.toISOString() } : null,
    pricePerColonyCents: row.price_per_colony_cents, currency: row.currency, respondBy: row.respond_by,
    distanceKm: row.distance_km == null ? null : Math.round(row.distance_km * 10) / 10,
  };
}

/** The request's terms as model attributes, from a checked body and its expected window. */
function termsOf(body: ParsedRequestBody, window: { from: Date; to: Date }) {
  return {
    title: body.title, coloniesRequested: body.blocks.reduce((s, b) => s + b.colonies, 0), minFramesOfBees: body.minFramesOfBees,
    minFramesOfBrood: body.minFramesOfBrood ?? null, arriveRule: body.arrive.rule,
    arriveBloomPercent: body.arrive.rule === 'bloom-stage' ? body.arrive.bloomPercent : null,
    arriveOn: body.arrive.rule === 'date' ? body.arrive.on : null, departRule: body.depart.rule, departOn: body.depart.rule === 'date' ? body.depart.on : null,
    expectedOnSite: timeRange(window.from, window.to), pricePerColonyCents: body.pricePerColonyCents, currency: body.currency,
    depositShareBp: body.depositShareBp, balanceDueDays: body.balanceDueDays, lateInterestBpPerMonth: body.lateInterestBpPerMonth,
    belowMinimumRateBp: body.belowMinimumRateBp, extraMoveFeeCents: body.extraMoveFeeCents, noticeHours: body.noticeHours,
    respondBy: body.respondBy ?? null, notes: body.notes ?? null,
  };
}

export type RequestsService = ReturnType<typeof createRequestsService>;

export function createRequestsService(ctx: AppContext) {

  /** Each block's current bloom window of its newest season. */
  async function latestBloomWindows(blockIds: string[], t?: Transaction): Promise<Map<string, BloomWindow>> {
    const rows = await ctx.models.BloomWindow.findAll({
      where: { blockId: blockIds }, order: [['season', 'DESC'], ['createdAt', 'DESC'], ['id', 'DESC']], transaction: t,
    });
    const latest = new Map<string, BloomWindow>();
    for (const w of rows) if (!latest.has(w.blockId)) latest.set(w.blockId, w);
    return latest;
  }

  async function checkBlocks(user: AuthUser, body: ParsedRequestBody, t: Transaction) {
    const blockIds = body.blocks.map((b) => b.blockId);
    const owned = await ctx.models.Block.findAll({ attributes: ['id'], where: { id: blockIds, farmId: user.organizationId! }, transaction: t });
    const ownedIds = new Set(owned.map((b) => b.id));
    const fields: Record<string, string> = {};
    body.blocks.forEach((b, i) => { if (!ownedIds.has(b.blockId)) fields[`blocks.${i}.blockId`] = 'is not one of your blocks'; });
    body.dropSites.forEach((d, i) => { if (!blockIds.includes(d.blockId)) fields[`dropSites.${i}.blockId`] = 'must be one of the blocks of this request'; });
    if (Object.keys(fields).length) throw badRequest(pleaseCheck(Object.keys(fields)), fields);
    const farm = await ctx.models.Organization.findByPk(user.organizationId!, { attributes: ['timeZone'], transaction: t, rejectOnEmpty: true });
    const bloomWindows = [...(await latestBloomWindows(blockIds, t)).values()].map((w) => ({ bloomStart: w.bloomStart, fullBloom: w.fullBloom, petalFall: w.petalFall }));
    try {
      return expectedOnSite({ arrive: body.arrive, depart: body.depart, bloomWindows, timeZone: farm.timeZone });
    } catch (err) {
      if (err instanceof WindowError) throw badRequest(pleaseCheck([err.field]), { [err.field]: err.message });
      throw err;
    }
  }

  async function writeParts(requestId: string, body: ParsedRequestBody, t: Transaction) {
    await ctx.models.HiveRequestBlock.bulkCreate(body.blocks.map((b) => ({ requestId, blockId: b.blockId, colonies: b.colonies })), { transaction: t });
    // One creation time for the request's sites, so they list by name (as entered together).
    const createdAt = new Date();
    await ctx.models.DropSite.bulkCreate(
      body.dropSites.map((d) => ({
        requestId, createdAt, blockId: d.blockId, name: d.name, location: d.location, coloniesPlanned: d.coloniesPlanned, accessNotes: d.accessNotes ?? null,
        vehicleAccess: d.vehicleAccess ?? null, gateCode: d.gateCode ?? null, waterSource: d.waterSource ?? null,
      })),
      { transaction: t },
    );
  }

  /** The request row locked for a change by its farm; 404 for anyone else's. */
  async function lockOwn(user: AuthUser, id: string, t: Transaction) {
    const row = await ctx.models.HiveRequest.scope({ method: ['ofFarm', user.organizationId] }).findOne({ where: { id }, transaction: t, lock: t.LOCK.UPDATE });
    if (!row) throw notFound('That request');
    return row;
  }

  async function announce(requestId: string, farmId: string) {
    const open = await coloniesOpen(ctx, requestId);
    publish(ctx, [farmId, ...(await apiaryIds(ctx))], 'request:updated', { requestId, state: open.state, coloniesOpen: open.coloniesOpen });
  }

  const service = {
    announce,

    async create(user: AuthUser, body: ParsedRequestBody): Promise<RequestDetailDto> {
      const id = await ctx.sequelize.transaction(async (t) => {
        const window = await checkBlocks(user, body, t);
        const request = await ctx.models.HiveRequest.create({ farmId: user.organizationId!, createdBy: user.id, ...termsOf(body, window) }, { transaction: t });
        await writeParts(request.id, body, t);
        await recordRequestEvent(ctx, t, request.id, user.id, 'created', { colonies: request.coloniesRequested });
        return request.id;
      });
      return service.get(user, id);
    },

    async update(user: AuthUser, id: string, body: ParsedRequestBody): Promise<RequestDetailDto> {
      await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['draft', 'listed'].includes(current.state)) throw wrongState(`A request that is ${labelOf(requestStateSet, current.state).toLowerCase()} can no longer be edited.`);
        if ((await committedColonies(ctx, id, t)) > 0) throw wrongState('Beekeepers have committed colonies to this request; it can no longer be edited. Withdraw it and ask again instead.');
        const window = await checkBlocks(user, body, t);
        await current.update(termsOf(body, window), { transaction: t });
        await ctx.models.DropSite.destroy({ where: { requestId: id }, transaction: t });
        await ctx.models.HiveRequestBlock.destroy({ where: { requestId: id }, transaction: t });
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
        if (current.state !== 'draft') throw wrongState(`Only a draft can be opened for commitments; this request is ${labelOf(requestStateSet, current.state).toLowerCase()}.`);
        if ((await ctx.models.DropSite.count({ where: { requestId: id }, transaction: t })) === 0) {
          throw badRequest('Add at least one drop site before opening the request.', { dropSites: 'add at least one drop site first' });
        }
        // respond_by is a calendar day at the farm; the deadline passes once that local day is over.
        const farm = await ctx.models.Organization.findByPk(current.farmId, { attributes: ['timeZone'], transaction: t });
        if (dayIsOver(current.respondBy, ctx.now(), farm?.timeZone ?? 'UTC')) {
          throw badRequest('The answer deadline has passed; set a later one first.', { respondBy: 'is in the past' });
        }
        await current.update({ state: 'listed' }, { transaction: t });
        await recordRequestEvent(ctx, t, id, user.id, 'opened', {});
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      await mailOrganizations(ctx, await apiaryIds(ctx), {
        subject: `New hive request: ${detail.title}`,
        text: `${detail.farmName} asks for ${detail.coloniesRequested} colonies (${detail.crops.join(', ')}), at least ${detail.minFramesOfBees} frames of bees.`,
      });
      return detail;
    },

    async withdraw(user: AuthUser, id: string): Promise<RequestDetailDto> {
      const affected = await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['draft', 'listed', 'filled'].includes(current.state)) throw wrongState(`A request that is ${labelOf(requestStateSet, current.state).toLowerCase()} cannot be withdrawn.`);
        if ((await ctx.models.Agreement.count({ where: { requestId: id, state: ['in-force', 'completed'] }, transaction: t })) > 0) {
          throw wrongState('An agreement for this request is confirmed by both sides; change it by amendment instead of withdrawing the request.');
        }
        const holding = await ctx.models.Commitment.scope('holding').findAll({ attributes: ['apiaryId'], where: { requestId: id }, transaction: t });
        const unsigned = await ctx.models.Agreement.findAll({ attributes: ['id'], where: { requestId: id, state: 'awaiting-signatures' }, transaction: t, lock: t.LOCK.UPDATE });
        await ctx.models.Agreement.update({ state: 'cancelled' }, { where: { id: unsigned.map((a) => a.id) }, transaction: t });
        // Their expected colonies no longer count in the spray conflict check.
        for (const agreement of unsigned) await agreementChanged(ctx, t, agreement.id);
        await ctx.models.Commitment.update(
          { state: 'withdrawn', decidedBy: user.id, decidedAt: ctx.now() },
          { where: { requestId: id, state: ['offered', 'accepted'] }, transaction: t },
        );
        await current.update({ state: 'withdrawn' }, { transaction: t });
        await recordRequestEvent(ctx, t, id, user.id, 'withdrawn', {});
        return { apiaryIds: [...new Set(holding.map((c) => c.apiaryId))], title: current.title };
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      await mailOrganizations(ctx, affected.apiaryIds, { subject: `Request withdrawn: ${affected.title}`, text: `${detail.farmName} withdrew the request "${affected.title}". Your commitment to it is released.` });
      return detail;
    },

    async close(user: AuthUser, id: string): Promise<RequestDetailDto> {
      await ctx.sequelize.transaction(async (t) => {
        const current = await lockOwn(user, id, t);
        if (!['listed', 'filled'].includes(current.state)) throw wrongState(`Only an open or fully committed request can be closed; this one is ${labelOf(requestStateSet, current.state).toLowerCase()}.`);
        await ctx.models.Commitment.update({ state: 'declined', decidedBy: user.id, decidedAt: ctx.now() }, { where: { requestId: id, state: 'offered' }, transaction: t });
        await current.update({ state: 'closed' }, { transaction: t });
        await recordRequestEvent(ctx, t, id, user.id, 'closed', {});
      });
      const detail = await service.get(user, id);
      await announce(id, detail.farmId);
      return detail;
    },

    async list(user: AuthUser, query: OpenRequestsQuery): Promise<RequestSummaryDto[]> {
      const rows = await requestSummaries(ctx.sequelize, {
        organizationId: user.organizationId!, isApiary: user.organizationKind === 'apiary',
        crop: query.crop, from: query.from, to: query.to, maxDistanceKm: query.maxDistanceKm,
      });
      return rows.map(toSummary);
    },

    async get(user: AuthUser, id: string): Promise<RequestDetailDto> {
      const isApiary = user.organizationKind === 'apiary';
      const [summary] = await requestSummaries(ctx.sequelize, { organizationId: user.organizationId!, isApiary, id });
      if (!summary) throw notFound('That request');
      const request = await ctx.models.HiveRequest.findByPk(id, {
        include: [
          { model: ctx.models.HiveRequestBlock, as: 'blockShares', include: [{ model: ctx.models.Block, as: 'block', attributes: ['id', 'name', 'crop', 'areaM2'] }] },
          { model: ctx.models.DropSite, as: 'dropSites' },
        ],
        order: [
          [{ model: ctx.models.HiveRequestBlock, as: 'blockShares' }, { model: ctx.models.Block, as: 'block' }, 'name', 'ASC'],
          [{ model: ctx.models.DropSite, as: 'dropSites' }, 'createdAt', 'ASC'],
          [{ model: ctx.models.DropSite, as: 'dropSites' }, 'name', 'ASC'],
          [{ model: ctx.models.DropSite, as: 'dropSites' }, 'id', 'ASC'],
        ],
        rejectOnEmpty: true,
      });
      const blockShares = request.blockShares!;
      const bloom = await latestBloomWindows(blockShares.map((s) => s.blockId));
      // The gate code stays with the grower until an agreement with this apiary is confirmed by both sides.
      const signed = isApiary
        ? (await ctx.models.Agreement.count({ where: { requestId: id, apiaryId: user.organizationId!, state: ['in-force', 'completed'] } })) > 0
        : true;
      const dropSites: DropSiteDto[] = request.dropSites!.map((s) => ({
        id: s.id, blockId: s.blockId, name: s.name, location: plainGeoJson(s.location), coloniesPlanned: s.coloniesPlanned, accessNotes: s.accessNotes,
        vehicleAccess: s.vehicleAccess, waterSource: s.waterSource, gateCode: signed ? s.gateCode : null, gateCodeHidden: !signed && s.gateCode != null,
      }));
      const commitments = await listCommitments(ctx, isApiary ? { requestId: id, apiaryId: user.organizationId! } : { requestId: id });
      const events: RequestEventDto[] = isApiary
        ? []
        : (
            await ctx.models.HiveRequestEvent.findAll({ where: { requestId: id }, include: [{ model: ctx.models.User, as: 'actor', attributes: ['name'] }], order: [['id', 'ASC']] })
          ).map((e) => ({ id: String(e.id), action: e.action, actorName: e.actor?.name ?? null, detail: e.detail, at: e.createdAt.toISOString() }));
      return {
        ...toSummary(summary),
        arrive: request.arriveRule === 'bloom-stage' ? { rule: 'bloom-stage', bloomPercent: request.arriveBloomPercent ?? 0 } : { rule: 'date', on: request.arriveOn! },
        depart: request.departRule === 'petal-fall' ? { rule: 'petal-fall' } : { rule: 'date', on: request.departOn! },
        depositShareBp: request.depositShareBp, balanceDueDays: request.balanceDueDays, lateInterestBpPerMonth: request.lateInterestBpPerMonth,
        belowMinimumRateBp: request.belowMinimumRateBp, extraMoveFeeCents: request.extraMoveFeeCents, noticeHours: request.noticeHours, notes: request.notes,
        blocks: blockShares.map((share) => {
          const w = bloom.get(share.blockId);
          return {
            blockId: share.blockId, name: share.block!.name, crop: share.block!.crop, acres: Math.round((share.block!.areaM2 / squareMetresPerAcre) * 100) / 100,
            colonies: share.colonies, bloomWindow: w ? { bloomStart: w.bloomStart, fullBloom: w.fullBloom, petalFall: w.petalFall } : null,
          };
        }),
        dropSites,
        commitments,
        events,
      };
    },
  };
  return service;
}

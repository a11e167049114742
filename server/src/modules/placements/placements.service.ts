// Placements in the field: the crew marks colonies delivered (time, position, photos),
// records strength checks, and marks them picked up; a grower may dispute a count. Each
// step is stored, told to the other side at once and by e-mail; delivery and pickup queue
// the spray conflict re-check in their transaction (placement-events.ts). on_site is the agreement's window until
// delivery, then [delivered_at, picked_up_at). A step's recorded time is bounded in field-step-time.ts.
import { Op, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { Placement } from '../../db/models/placement.model.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { plainGeoJson } from '../../db/geojson.js';
import { rangeBounds, timeRange } from '../../db/time-range.js';
import { minimumSampleSize, summarizeStrength } from '../../../../shared/domain/strength-check.js';
import type { DeliveryBody, DisputeBody, PickupBody, PlacementDto, PlacementState, StrengthCheckBody } from '../../../../shared/schemas/placements.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { mailOrganizations, publish } from '../requests/notify.js';
import { placementChanged, type PlacementChangeReason } from './placement-events.js';
import { sniffImageType } from './placement-photos.js';
import { recordedOrReceived, refuseBeforeAgreement } from './field-step-time.js';
import { zonedDateTime } from '../../../../shared/domain/zoned-time.js';
import { agreementStateSet } from '../../../../shared/labels/agreements.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';

const stepLabels: Record<PlacementChangeReason, string> = {
  scheduled: 'scheduled', delivered: 'dropped off', 'picked-up': 'picked up', 'strength-checked': 'strength checked', disputed: 'disputed',
  'agreement-amended': 'changed by amendment', 'agreement-ended': 'ended',
};

const stateRank: Record<PlacementState, number> = { scheduled: 0, delivered: 1, 'picked-up': 2 };
const iso = (at: Date | null | undefined) => (at ? at.toISOString() : null);

export type PlacementsService = ReturnType<typeof createPlacementsService>;

export function createPlacementsService(ctx: AppContext) {
  const ofParty = (organizationId: string | null) => ({ [Op.or]: [{ farmId: organizationId }, { apiaryId: organizationId }] });

  /** A placement with everything its answer shows. */
  const fullPlacement = () => ({
    include: [
      {
        model: ctx.models.Agreement, as: 'agreement', attributes: ['id', 'state', 'requestId', 'farmId', 'apiaryId', 'minFramesOfBees', 'minFramesOfBrood'],
        include: [
          { model: ctx.models.HiveRequest, as: 'request', attributes: ['title'] },
          { model: ctx.models.Organization, as: 'farm', attributes: ['name', 'timeZone'] },
          { model: ctx.models.Organization, as: 'apiary', attributes: ['name'] },
        ],
      },
      { model: ctx.models.DropSite, as: 'dropSite', include: [{ model: ctx.models.Block, as: 'block', attributes: ['name'] }] },
      { model: ctx.models.User, as: 'deliverer', attributes: ['name'] },
      { model: ctx.models.User, as: 'picker', attributes: ['name'] },
      { model: ctx.models.User, as: 'disputer', attributes: ['name'] },
      { model: ctx.models.StrengthCheck, as: 'strengthChecks', include: [{ model: ctx.models.User, as: 'checker', attributes: ['name'] }] },
      { model: ctx.models.PlacementPhoto, as: 'photos', attributes: ['id', 'step', 'createdAt', 'recordedAt'] },
    ],
    order: [
      [{ model: ctx.models.StrengthCheck, as: 'strengthChecks' }, 'checkedAt', 'ASC'],
      [{ model: ctx.models.StrengthCheck, as: 'strengthChecks' }, 'id', 'ASC'],
      [{ model: ctx.models.PlacementPhoto, as: 'photos' }, 'createdAt', 'ASC'],
      [{ model: ctx.models.PlacementPhoto, as: 'photos' }, 'id', 'ASC'],
    ] as never,
  });

  function toDto(p: Placement): PlacementDto {
    const a = p.agreement!;
    const site = p.dropSite!;
    return {
      id: p.id, agreementId: p.agreementId, requestId: a.requestId, requestTitle: a.request!.title, farmName: a.farm!.name, apiaryName: a.apiary!.name,
      state: p.state,
      dropSite: { id: site.id, name: site.name, location: plainGeoJson(site.location), gateCode: site.gateCode, vehicleAccess: site.vehicleAccess, accessNotes: site.accessNotes, waterSource: site.waterSource },
      blockName: site.block!.name, coloniesPlanned: p.coloniesPlanned, minFramesOfBees: a.minFramesOfBees, onSite: rangeBounds(p.onSite) ?? { from: null, to: null },
      coloniesDelivered: p.coloniesDelivered, deliveredAt: iso(p.deliveredAt), deliveredLocation: plainGeoJson(p.deliveredLocation ?? null),
      deliveredByName: p.deliverer?.name ?? null, coloniesPickedUp: p.coloniesPickedUp, pickedUpAt: iso(p.pickedUpAt), pickedUpByName: p.picker?.name ?? null,
      deliveredRecordedAt: iso(p.deliveredRecordedAt), deliveredReceivedAt: iso(p.deliveredReceivedAt), deliveredAccuracyM: p.deliveredAccuracyM,
      pickedUpRecordedAt: iso(p.pickedUpRecordedAt), pickedUpReceivedAt: iso(p.pickedUpReceivedAt),
      dispute: p.disputeNote ? { step: p.disputeStep, countedColonies: p.disputedCount, note: p.disputeNote, byName: p.disputer?.name ?? null, at: iso(p.disputedAt)! } : null,
      strengthChecks: p.strengthChecks!.map((c) => ({
        id: c.id, checkedAt: c.checkedAt.toISOString(), checkedByName: c.checker?.name ?? null, inspectorName: c.inspectorName, coloniesInGroup: c.coloniesInGroup,
        framesOfBees: c.framesOfBees, framesOfBrood: c.framesOfBrood, notes: c.notes, receivedAt: iso(c.receivedAt),
        summary: summarizeStrength({ coloniesInGroup: c.coloniesInGroup, framesOfBees: c.framesOfBees, minFramesOfBees: a.minFramesOfBees, framesOfBrood: c.framesOfBrood ?? undefined, minFramesOfBrood: a.minFramesOfBrood }),
      })),
      photos: p.photos!.map((photo) => ({ id: photo.id, step: photo.step, url: `/api/placements/${p.id}/photos/${photo.id}`, at: photo.createdAt.toISOString(), recordedAt: iso(photo.recordedAt) })),
    };
  }

  async function findOwn(user: AuthUser, id: string): Promise<Placement> {
    const row = await ctx.models.Placement.findOne({ where: { id }, ...fullPlacement() });
    if (!row || (row.agreement!.farmId !== user.organizationId && row.agreement!.apiaryId !== user.organizationId)) throw notFound('That placement');
    return row;
  }

  /** The placement row locked (not its agreement) for a change by one of the agreement's parties, with its agreement; 404 for anyone else. */
  async function lockParty(user: AuthUser, id: string, t: Transaction, parties = ofParty(user.organizationId)) {
    return ctx.models.Placement.findOne({
      where: { id },
      include: [{ model: ctx.models.Agreement, as: 'agreement', attributes: ['id', 'state', 'requestId', 'farmId', 'apiaryId', 'minFramesOfBees', 'version', 'createdAt'], where: parties }],
      transaction: t,
      lock: { level: t.LOCK.UPDATE, of: ctx.models.Placement },
    });
  }

  /** Locks the placement for a field step and checks its agreement is in force. */
  async function lockForStep(user: AuthUser, id: string, t: Transaction) {
    const row = await lockParty(user, id, t);
    if (!row) throw notFound('That placement');
    if (row.agreement!.state !== 'in-force') throw wrongState(`The agreement for this placement is ${labelOf(agreementStateSet, row.agreement!.state).toLowerCase()}.`);
    return row;
  }

  /** The step's time: the phone's recorded time, never in the future (before the agreement is checked once it is locked). */
  const timeOrNow = (value: string | undefined, field: string) => recordedOrReceived(value, field, ctx.now());

  /** Tells the other side by e-mail; `mailText` gets the farm's time zone so times read in it. */
  async function after(user: AuthUser, id: string, reason: PlacementChangeReason, mailText: string | ((timeZone: string) => string)) {
    const row = await findOwn(user, id);
    const { farmId, apiaryId } = row.agreement!;
    publish(ctx, [farmId, apiaryId], 'placement:updated', { placementId: id, agreementId: row.agreementId, state: row.state, step: reason });
    const otherSide = user.organizationId === farmId ? apiaryId : farmId;
    await mailOrganizations(ctx, [otherSide], {
      subject: `${row.dropSite!.name} (${row.dropSite!.block!.name}): ${stepLabels[reason]}`,
      text: `${user.name} of ${user.organizationName}: ${typeof mailText === 'function' ? mailText(row.agreement!.farm!.timeZone) : mailText}\nRequest: ${row.agreement!.request!.title}`,
      includeCrew: otherSide === apiaryId,
    });
    return toDto(await findOwn(user, id));
  }

  return {
    async list(user: AuthUser, filter: { agreementId?: string } = {}): Promise<PlacementDto[]> {
      const full = fullPlacement();
      const rows = await ctx.models.Placement.findAll({
        ...full,
        include: [
          { ...full.include[0], where: { ...ofParty(user.organizationId), state: ['in-force', 'completed'], ...(filter.agreementId ? { id: filter.agreementId } : {}) } },
          ...full.include.slice(1),
        ],
      });
      const start = (p: Placement) => p.onSite[0].value?.getTime() ?? -Infinity;
      rows.sort((a, b) => stateRank[a.state as PlacementState] - stateRank[b.state as PlacementState] || start(a) - start(b)
        || (a.dropSite!.name < b.dropSite!.name ? -1 : a.dropSite!.name > b.dropSite!.name ? 1 : 0) || (a.id < b.id ? -1 : 1));
      return rows.map(toDto);
    },

    get: async (user: AuthUser, id: string) => toDto(await findOwn(user, id)),

    async deliver(user: AuthUser, id: string, body: DeliveryBody) {
      if (body.coloniesDelivered < 1) throw badRequest(pleaseCheck(['coloniesDelivered']), { coloniesDelivered: 'must be at least 1' });
      const at = timeOrNow(body.deliveredAt, 'deliveredAt');
      const receivedAt = ctx.now();
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'scheduled') throw wrongState(`These colonies are already ${p.state === 'delivered' ? 'dropped off' : 'picked up'}.`);
        await refuseBeforeAgreement(ctx, t, p.agreement!, at, 'deliveredAt', 'drop-off');
        const site = await ctx.models.DropSite.findByPk(p.dropSiteId, { attributes: ['location'], transaction: t, rejectOnEmpty: true });
        await p.update({
          state: 'delivered', coloniesDelivered: body.coloniesDelivered, deliveredAt: at, deliveredBy: user.id,
          deliveredLocation: body.location ?? plainGeoJson(site.location), onSite: timeRange(at, null),
          deliveredRecordedAt: body.deliveredAt ? new Date(body.deliveredAt) : receivedAt, deliveredReceivedAt: receivedAt, deliveredAccuracyM: body.accuracyM ?? null,
        }, { transaction: t });
        await recordRequestEvent(ctx, t, p.agreement!.requestId, user.id, 'placement-delivered', { placementId: id, colonies: body.coloniesDelivered });
        await placementChanged(ctx, t, id, 'delivered');
      });
      return after(user, id, 'delivered', (zone) => `${body.coloniesDelivered} colonies dropped off ${zonedDateTime(at, zone)} (${zone}).`);
    },

    async pickup(user: AuthUser, id: string, body: PickupBody) {
      const at = timeOrNow(body.pickedUpAt, 'pickedUpAt');
      const receivedAt = ctx.now();
      const ended = await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'delivered') throw wrongState(p.state === 'scheduled' ? 'These colonies have not been dropped off yet.' : 'These colonies are already picked up.');
        await refuseBeforeAgreement(ctx, t, p.agreement!, at, 'pickedUpAt', 'pickup');
        if (body.coloniesPickedUp > p.coloniesDelivered!) throw badRequest(pleaseCheck(['coloniesPickedUp']), { coloniesPickedUp: `cannot be more than the ${p.coloniesDelivered} dropped off` });
        if (at <= p.deliveredAt!) throw badRequest(pleaseCheck(['pickedUpAt']), { pickedUpAt: 'must be after the drop-off' });
        await p.update({
          state: 'picked-up', coloniesPickedUp: body.coloniesPickedUp, pickedUpAt: at, pickedUpBy: user.id, onSite: timeRange(p.deliveredAt, at),
          pickedUpRecordedAt: body.pickedUpAt ? new Date(body.pickedUpAt) : receivedAt, pickedUpReceivedAt: receivedAt,
        }, { transaction: t });
        await recordRequestEvent(ctx, t, p.agreement!.requestId, user.id, 'placement-picked-up', { placementId: id, colonies: body.coloniesPickedUp });
        await placementChanged(ctx, t, id, 'picked-up');
        const stillOut = await ctx.models.Placement.count({ where: { agreementId: p.agreementId, state: { [Op.ne]: 'picked-up' } }, transaction: t });
        if (stillOut > 0) return null;
        const agreement = p.agreement!;
        await ctx.models.Agreement.update({ state: 'completed' }, { where: { id: agreement.id }, transaction: t });
        return { agreementId: agreement.id, requestId: agreement.requestId, farmId: agreement.farmId, apiaryId: agreement.apiaryId, version: agreement.version };
      });
      const dto = await after(user, id, 'picked-up', (zone) => `${body.coloniesPickedUp} colonies picked up ${zonedDateTime(at, zone)} (${zone}).`);
      if (ended) publish(ctx, [ended.farmId, ended.apiaryId], 'agreement:updated', { agreementId: ended.agreementId, requestId: ended.requestId, state: 'completed', version: ended.version });
      return dto;
    },

    async recordStrengthCheck(user: AuthUser, id: string, body: StrengthCheckBody) {
      const at = timeOrNow(body.checkedAt, 'checkedAt');
      const receivedAt = ctx.now();
      let summaryText = '';
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'delivered') throw wrongState(p.state === 'scheduled' ? 'Colonies are checked once they are dropped off.' : 'These colonies are already picked up.');
        await refuseBeforeAgreement(ctx, t, p.agreement!, at, 'checkedAt', 'strength check');
        if (at < p.deliveredAt!) throw badRequest(pleaseCheck(['checkedAt']), { checkedAt: 'cannot be before the drop-off' });
        const group = body.coloniesInGroup ?? p.coloniesDelivered!;
        const required = minimumSampleSize(group);
        const fields: Record<string, string> = {};
        if (body.framesOfBees.length < required) fields.framesOfBees = `open at least ${required} colonies (10% of ${group}, rounded up)`;
        if (body.framesOfBees.length > group) fields.framesOfBees = `cannot list more colonies than the ${group} in the group`;
        if (body.framesOfBrood?.length && body.framesOfBrood.length !== body.framesOfBees.length) fields.framesOfBrood = 'must list one value per colony opened, like framesOfBees';
        if (Object.keys(fields).length) throw badRequest(pleaseCheck(Object.keys(fields)), fields);
        await ctx.models.StrengthCheck.create({
          placementId: id, checkedAt: at, checkedBy: user.id, inspectorName: body.inspectorName ?? null, coloniesInGroup: group,
          framesOfBees: body.framesOfBees, framesOfBrood: body.framesOfBrood?.length ? body.framesOfBrood : null, notes: body.notes ?? null,
          recordedAt: body.checkedAt ? new Date(body.checkedAt) : receivedAt, receivedAt,
        }, { transaction: t });
        const min = p.agreement!.minFramesOfBees;
        const summary = summarizeStrength({ coloniesInGroup: group, framesOfBees: body.framesOfBees, minFramesOfBees: min });
        summaryText = `${summary.sampled} colonies opened, average ${summary.averageFramesOfBees} frames of bees, ${Math.round(summary.belowMinimumShare * 100)}% below ${min}: ${summary.meetsAgreement ? 'meets' : 'does not meet'} the agreement.`;
        await recordRequestEvent(ctx, t, p.agreement!.requestId, user.id, 'strength-checked', { placementId: id, average: summary.averageFramesOfBees, meetsAgreement: summary.meetsAgreement });
      });
      return after(user, id, 'strength-checked', summaryText);
    },

    async dispute(user: AuthUser, id: string, body: DisputeBody) {
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t).catch(async (err) => {
          // A count may still be disputed after the agreement is completed.
          const row = await lockParty(user, id, t, { farmId: user.organizationId } as never);
          if (row && row.agreement!.state === 'completed') return row;
          throw err;
        });
        if (body.step === 'delivery' && p.state === 'scheduled') throw wrongState('Nothing has been delivered yet to dispute.');
        if (body.step === 'pickup' && p.state !== 'picked-up') throw wrongState('Nothing has been picked up yet to dispute.');
        await p.update({ disputeNote: body.note, disputeStep: body.step, disputedCount: body.countedColonies ?? null, disputedBy: user.id, disputedAt: ctx.now() }, { transaction: t });
        await recordRequestEvent(ctx, t, p.agreement!.requestId, user.id, 'count-disputed', { placementId: id, step: body.step, countedColonies: body.countedColonies ?? null });
      });
      return after(user, id, 'disputed', `the ${body.step} count is disputed${body.countedColonies != null ? ` (grower counted ${body.countedColonies})` : ''}: ${body.note}`);
    },

    async addPhoto(user: AuthUser, id: string, step: string, file: Express.Multer.File | undefined, recordedAt?: string) {
      if (!file) throw badRequest('Please attach a photo.', { photo: 'is required' });
      const type = sniffImageType(file.buffer);
      if (!type || type !== file.mimetype) throw badRequest('That file is not the image it says it is.', { photo: 'must be a JPEG, PNG or WebP image' });
      const at = recordedAt ? timeOrNow(recordedAt, 'recordedAt') : null;
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state === 'scheduled' && step !== 'delivery') throw wrongState('Colonies are not delivered yet.');
        if (at) await refuseBeforeAgreement(ctx, t, p.agreement!, at, 'recordedAt', 'photo');
        // A strength-check or pickup photo shows colonies on site; a drop-off photo may be taken as they are set down, before the step is marked.
        if (at && step !== 'delivery' && p.deliveredAt && at < p.deliveredAt) throw badRequest(pleaseCheck(['recordedAt']), { recordedAt: 'cannot be before the drop-off' });
        await ctx.models.PlacementPhoto.create({
          placementId: id, step, contentType: type, byteSize: file.size, data: file.buffer, uploadedBy: user.id, createdAt: ctx.now(),
          recordedAt: at,
        }, { transaction: t });
      });
      const row = await findOwn(user, id);
      publish(ctx, [row.agreement!.farmId, row.agreement!.apiaryId], 'placement:updated', { placementId: id, agreementId: row.agreementId, state: row.state, step: 'photo' });
      return toDto(row);
    },

    async photo(user: AuthUser, id: string, photoId: string): Promise<{ contentType: string; data: Buffer }> {
      await findOwn(user, id);
      const row = await ctx.models.PlacementPhoto.findOne({ attributes: ['contentType', 'data'], where: { id: photoId, placementId: id } });
      if (!row) throw notFound('That photo');
      return { contentType: row.contentType, data: row.data };
    },
  };
}

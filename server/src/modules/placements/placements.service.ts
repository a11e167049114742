// Placements in the field: the crew marks colonies delivered (time, position, photos),
// records strength checks, and marks them picked up; a grower may dispute a count. Each
// step is stored, told to the other side at once and by e-mail; delivery and pickup queue
// the spray conflict re-check in their transaction (placement-events.ts). on_site is the agreement's window until
// delivery, then [delivered_at, picked_up_at).
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { minimumSampleSize, summarizeStrength } from '../../../../shared/domain/strength-check.js';
import type { DeliveryBody, DisputeBody, PickupBody, PlacementDto, PlacementState, StrengthCheckBody } from '../../../../shared/schemas/placements.js';
import { execute, iso, parseRange, selectOne, selectRows } from '../requests/sql.js';
import { recordRequestEvent } from '../requests/request-events.js';
import { mailOrganizations, publish } from '../requests/notify.js';
import { announceAgreement } from '../agreements/agreement-create.js';
import { placementChanged, type PlacementChangeReason } from './placement-events.js';
import { sniffImageType } from './placement-photos.js';

type PlacementRow = {
  id: string; agreement_id: string; request_id: string; request_title: string; farm_id: string; farm_name: string; apiary_id: string; apiary_name: string;
  agreement_state: string; state: PlacementState; drop_site_id: string; drop_site_name: string; drop_site_location: string; gate_code: string | null;
  vehicle_access: string | null; access_notes: string | null; water_source: string | null; block_name: string; colonies_planned: number;
  min_frames_of_bees: number; min_frames_of_brood: number | null; on_site: string; colonies_delivered: number | null; delivered_at: Date | null;
  delivered_location: string | null; delivered_name: string | null; colonies_picked_up: number | null; picked_up_at: Date | null; picked_up_name: string | null;
  dispute_note: string | null; dispute_step: 'delivery' | 'pickup' | null; disputed_count: number | null; disputed_name: string | null; disputed_at: Date | null;
};

const selectPlacements = `
  SELECT p.*, p.on_site::text AS on_site, a.request_id, r.title AS request_title, a.farm_id, fo.name AS farm_name, a.apiary_id, ao.name AS apiary_name,
    a.state AS agreement_state, a.min_frames_of_bees, a.min_frames_of_brood, d.name AS drop_site_name, ST_AsGeoJSON(d.location) AS drop_site_location,
    d.gate_code, d.vehicle_access, d.access_notes, d.water_source, b.name AS block_name, ST_AsGeoJSON(p.delivered_location) AS delivered_location,
    du.name AS delivered_name, pu.name AS picked_up_name, xu.name AS disputed_name
  FROM placements p JOIN agreements a ON a.id = p.agreement_id JOIN hive_requests r ON r.id = a.request_id
  JOIN organizations fo ON fo.id = a.farm_id JOIN organizations ao ON ao.id = a.apiary_id
  JOIN drop_sites d ON d.id = p.drop_site_id JOIN blocks b ON b.id = d.block_id
  LEFT JOIN users du ON du.id = p.delivered_by LEFT JOIN users pu ON pu.id = p.picked_up_by LEFT JOIN users xu ON xu.id = p.disputed_by`;

const stepLabels: Record<PlacementChangeReason, string> = {
  scheduled: 'scheduled', delivered: 'delivered', 'picked-up': 'picked up', 'strength-checked': 'strength checked', disputed: 'disputed',
  'agreement-amended': 'changed by amendment', 'agreement-ended': 'ended',
};

export function createPlacementsService(ctx: AppContext) {
  async function toDto(row: PlacementRow): Promise<PlacementDto> {
    const checks = await selectRows<{ id: string; checked_at: Date; checked_name: string | null; inspector_name: string | null; colonies_in_group: number; frames_of_bees: number[]; frames_of_brood: number[] | null; notes: string | null }>(
      ctx,
      'SELECT s.*, u.name AS checked_name FROM strength_checks s LEFT JOIN users u ON u.id = s.checked_by WHERE s.placement_id = :id ORDER BY s.checked_at, s.id',
      { id: row.id },
    );
    const photos = await selectRows<{ id: string; step: string; created_at: Date }>(ctx, 'SELECT id, step, created_at FROM placement_photos WHERE placement_id = :id ORDER BY created_at, id', { id: row.id });
    const window = parseRange(row.on_site) ?? { from: null, to: null };
    return {
      id: row.id, agreementId: row.agreement_id, requestId: row.request_id, requestTitle: row.request_title, farmName: row.farm_name, apiaryName: row.apiary_name,
      state: row.state,
      dropSite: { id: row.drop_site_id, name: row.drop_site_name, location: JSON.parse(row.drop_site_location), gateCode: row.gate_code, vehicleAccess: row.vehicle_access, accessNotes: row.access_notes, waterSource: row.water_source },
      blockName: row.block_name, coloniesPlanned: row.colonies_planned, minFramesOfBees: row.min_frames_of_bees, onSite: window,
      coloniesDelivered: row.colonies_delivered, deliveredAt: iso(row.delivered_at), deliveredLocation: row.delivered_location ? JSON.parse(row.delivered_location) : null,
      deliveredByName: row.delivered_name, coloniesPickedUp: row.colonies_picked_up, pickedUpAt: iso(row.picked_up_at), pickedUpByName: row.picked_up_name,
      dispute: row.dispute_note ? { step: row.dispute_step, countedColonies: row.disputed_count, note: row.dispute_note, byName: row.disputed_name, at: iso(row.disputed_at)! } : null,
      strengthChecks: checks.map((c) => ({
        id: c.id, checkedAt: iso(c.checked_at)!, checkedByName: c.checked_name, inspectorName: c.inspector_name, coloniesInGroup: c.colonies_in_group,
        framesOfBees: c.frames_of_bees.map(Number), framesOfBrood: c.frames_of_brood?.map(Number) ?? null, notes: c.notes,
        summary: summarizeStrength({ coloniesInGroup: c.colonies_in_group, framesOfBees: c.frames_of_bees.map(Number), minFramesOfBees: row.min_frames_of_bees, framesOfBrood: c.frames_of_brood?.map(Number), minFramesOfBrood: row.min_frames_of_brood }),
      })),
      photos: photos.map((p) => ({ id: p.id, step: p.step, url: `/api/placements/${row.id}/photos/${p.id}`, at: iso(p.created_at)! })),
    };
  }

  async function findOwn(user: AuthUser, id: string): Promise<PlacementRow> {
    const row = await selectOne<PlacementRow>(ctx, `${selectPlacements} WHERE p.id = :id AND (a.farm_id = :org OR a.apiary_id = :org)`, { id, org: user.organizationId });
    if (!row) throw notFound('That placement');
    return row;
  }

  /** Locks the placement for a field step and checks its agreement is in force. */
  async function lockForStep(user: AuthUser, id: string, t: import('sequelize').Transaction) {
    const row = await selectOne<{ id: string; state: PlacementState; agreement_state: string; delivered_at: Date | null; colonies_delivered: number | null; request_id: string }>(
      ctx,
      `SELECT p.id, p.state, a.state AS agreement_state, p.delivered_at, p.colonies_delivered, a.request_id FROM placements p JOIN agreements a ON a.id = p.agreement_id
       WHERE p.id = :id AND (a.farm_id = :org OR a.apiary_id = :org) FOR UPDATE OF p`,
      { id, org: user.organizationId },
      t,
    );
    if (!row) throw notFound('That placement');
    if (row.agreement_state !== 'in-force') throw wrongState(`The agreement for this placement is ${row.agreement_state}.`);
    return row;
  }

  function timeOrNow(value: string | undefined, field: string): Date {
    const at = value ? new Date(value) : ctx.now();
    if (at.getTime() > ctx.now().getTime() + 5 * 60_000) throw badRequest(`Please check: ${field}.`, { [field]: 'cannot be in the future' });
    return at;
  }

  async function after(user: AuthUser, id: string, reason: PlacementChangeReason, mailText: string) {
    const row = await findOwn(user, id);
    publish(ctx, [row.farm_id, row.apiary_id], 'placement:updated', { placementId: id, agreementId: row.agreement_id, state: row.state, step: reason });
    const otherSide = user.organizationId === row.farm_id ? row.apiary_id : row.farm_id;
    await mailOrganizations(ctx, [otherSide], {
      subject: `${row.drop_site_name} (${row.block_name}): ${stepLabels[reason]}`,
      text: `${user.name} of ${user.organizationName}: ${mailText}\nRequest: ${row.request_title}`,
      includeCrew: otherSide === row.apiary_id,
    });
    return toDto(await findOwn(user, id));
  }

  return {
    async list(user: AuthUser, filter: { agreementId?: string } = {}): Promise<PlacementDto[]> {
      const rows = await selectRows<PlacementRow>(
        ctx,
        `${selectPlacements} WHERE (a.farm_id = :org OR a.apiary_id = :org) AND a.state IN ('in-force', 'completed') ${filter.agreementId ? 'AND a.id = :agreementId' : ''}
         ORDER BY CASE p.state WHEN 'scheduled' THEN 0 WHEN 'delivered' THEN 1 ELSE 2 END, lower(p.on_site), d.name, p.id`,
        { org: user.organizationId, agreementId: filter.agreementId ?? null },
      );
      return Promise.all(rows.map(toDto));
    },

    get: async (user: AuthUser, id: string) => toDto(await findOwn(user, id)),

    async deliver(user: AuthUser, id: string, body: DeliveryBody) {
      if (body.coloniesDelivered < 1) throw badRequest('Please check: coloniesDelivered.', { coloniesDelivered: 'must be at least 1' });
      const at = timeOrNow(body.deliveredAt, 'deliveredAt');
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'scheduled') throw wrongState(`These colonies are already ${p.state === 'delivered' ? 'delivered' : 'picked up'}.`);
        await execute(
          ctx,
          `UPDATE placements SET state = 'delivered', colonies_delivered = :count, delivered_at = :at, delivered_by = :userId,
             delivered_location = CASE WHEN :location::text IS NULL THEN (SELECT location FROM drop_sites WHERE id = placements.drop_site_id)
                                       ELSE ST_SetSRID(ST_GeomFromGeoJSON(:location), 4326) END,
             on_site = tstzrange(:at::timestamptz, NULL, '[)'), updated_at = now()
           WHERE id = :id`,
          { id, count: body.coloniesDelivered, at: at.toISOString(), userId: user.id, location: body.location ? JSON.stringify(body.location) : null },
          t,
        );
        await recordRequestEvent(ctx, t, p.request_id, user.id, 'placement-delivered', { placementId: id, colonies: body.coloniesDelivered });
        await placementChanged(ctx, t, id, 'delivered');
      });
      return after(user, id, 'delivered', `${body.coloniesDelivered} colonies delivered at ${at.toISOString()}.`);
    },

    async pickup(user: AuthUser, id: string, body: PickupBody) {
      const at = timeOrNow(body.pickedUpAt, 'pickedUpAt');
      const ended = await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'delivered') throw wrongState(p.state === 'scheduled' ? 'These colonies have not been delivered yet.' : 'These colonies are already picked up.');
        if (body.coloniesPickedUp > p.colonies_delivered!) throw badRequest('Please check: coloniesPickedUp.', { coloniesPickedUp: `cannot be more than the ${p.colonies_delivered} delivered` });
        if (at <= new Date(p.delivered_at!)) throw badRequest('Please check: pickedUpAt.', { pickedUpAt: 'must be after the delivery' });
        await execute(
          ctx,
          `UPDATE placements SET state = 'picked-up', colonies_picked_up = :count, picked_up_at = :at, picked_up_by = :userId,
             on_site = tstzrange(delivered_at, :at::timestamptz, '[)'), updated_at = now() WHERE id = :id`,
          { id, count: body.coloniesPickedUp, at: at.toISOString(), userId: user.id },
          t,
        );
        await recordRequestEvent(ctx, t, p.request_id, user.id, 'placement-picked-up', { placementId: id, colonies: body.coloniesPickedUp });
        await placementChanged(ctx, t, id, 'picked-up');
        const open = await selectOne<{ agreement_id: string; n: string }>(
          ctx,
          "SELECT agreement_id, count(*) FILTER (WHERE state <> 'picked-up') AS n FROM placements WHERE agreement_id = (SELECT agreement_id FROM placements WHERE id = :id) GROUP BY agreement_id",
          { id },
          t,
        );
        if (open && Number(open.n) === 0) {
          await execute(ctx, "UPDATE agreements SET state = 'completed', updated_at = now() WHERE id = :agreementId", { agreementId: open.agreement_id }, t);
          return open.agreement_id;
        }
        return null;
      });
      const dto = await after(user, id, 'picked-up', `${body.coloniesPickedUp} colonies picked up at ${at.toISOString()}.`);
      if (ended) await announceAgreement(ctx, ended);
      return dto;
    },

    async recordStrengthCheck(user: AuthUser, id: string, body: StrengthCheckBody) {
      const at = timeOrNow(body.checkedAt, 'checkedAt');
      let summaryText = '';
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state !== 'delivered') throw wrongState(p.state === 'scheduled' ? 'Colonies are checked once they are delivered.' : 'These colonies are already picked up.');
        const group = body.coloniesInGroup ?? p.colonies_delivered!;
        const required = minimumSampleSize(group);
        const fields: Record<string, string> = {};
        if (body.framesOfBees.length < required) fields.framesOfBees = `open at least ${required} colonies (10% of ${group}, rounded up)`;
        if (body.framesOfBees.length > group) fields.framesOfBees = `cannot list more colonies than the ${group} in the group`;
        if (body.framesOfBrood?.length && body.framesOfBrood.length !== body.framesOfBees.length) fields.framesOfBrood = 'must list one value per colony opened, like framesOfBees';
        if (Object.keys(fields).length) throw badRequest(`Please check: ${Object.keys(fields).join(', ')}.`, fields);
        await execute(
          ctx,
          `INSERT INTO strength_checks (placement_id, checked_at, checked_by, inspector_name, colonies_in_group, frames_of_bees, frames_of_brood, notes)
           VALUES (:id, :at, :userId, :inspector, :group, :bees::double precision[], :brood::double precision[], :notes)`,
          {
            id, at: at.toISOString(), userId: user.id, inspector: body.inspectorName ?? null, group, notes: body.notes ?? null,
            bees: `{${body.framesOfBees.join(',')}}`, brood: body.framesOfBrood?.length ? `{${body.framesOfBrood.join(',')}}` : null,
          },
          t,
        );
        const min = (await selectOne<{ m: number }>(ctx, 'SELECT a.min_frames_of_bees AS m FROM placements p JOIN agreements a ON a.id = p.agreement_id WHERE p.id = :id', { id }, t))!.m;
        const summary = summarizeStrength({ coloniesInGroup: group, framesOfBees: body.framesOfBees, minFramesOfBees: min });
        summaryText = `${summary.sampled} colonies opened, average ${summary.averageFramesOfBees} frames of bees, ${Math.round(summary.belowMinimumShare * 100)}% below ${min}: ${summary.meetsAgreement ? 'meets' : 'does not meet'} the agreement.`;
        await recordRequestEvent(ctx, t, p.request_id, user.id, 'strength-checked', { placementId: id, average: summary.averageFramesOfBees, meetsAgreement: summary.meetsAgreement });
      });
      return after(user, id, 'strength-checked', summaryText);
    },

    async dispute(user: AuthUser, id: string, body: DisputeBody) {
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t).catch(async (err) => {
          // A count may still be disputed after the agreement is completed.
          const row = await selectOne<{ id: string; state: PlacementState; request_id: string; agreement_state: string }>(ctx, 'SELECT p.id, p.state, a.request_id, a.state AS agreement_state FROM placements p JOIN agreements a ON a.id = p.agreement_id WHERE p.id = :id AND a.farm_id = :org FOR UPDATE OF p', { id, org: user.organizationId }, t);
          if (row && row.agreement_state === 'completed') return { ...row, delivered_at: null, colonies_delivered: null };
          throw err;
        });
        if (body.step === 'delivery' && p.state === 'scheduled') throw wrongState('Nothing has been delivered yet to dispute.');
        if (body.step === 'pickup' && p.state !== 'picked-up') throw wrongState('Nothing has been picked up yet to dispute.');
        await execute(
          ctx,
          'UPDATE placements SET dispute_note = :note, dispute_step = :step, disputed_count = :count, disputed_by = :userId, disputed_at = :now, updated_at = now() WHERE id = :id',
          { id, note: body.note, step: body.step, count: body.countedColonies ?? null, userId: user.id, now: ctx.now().toISOString() },
          t,
        );
        await recordRequestEvent(ctx, t, p.request_id, user.id, 'count-disputed', { placementId: id, step: body.step, countedColonies: body.countedColonies ?? null });
      });
      return after(user, id, 'disputed', `the ${body.step} count is disputed${body.countedColonies != null ? ` (grower counted ${body.countedColonies})` : ''}: ${body.note}`);
    },

    async addPhoto(user: AuthUser, id: string, step: string, file: Express.Multer.File | undefined) {
      if (!file) throw badRequest('Please attach a photo.', { photo: 'is required' });
      const type = sniffImageType(file.buffer);
      if (!type || type !== file.mimetype) throw badRequest('That file is not the image it says it is.', { photo: 'must be a JPEG, PNG or WebP image' });
      await ctx.sequelize.transaction(async (t) => {
        const p = await lockForStep(user, id, t);
        if (p.state === 'scheduled' && step !== 'delivery') throw wrongState('Colonies are not delivered yet.');
        await execute(
          ctx,
          'INSERT INTO placement_photos (placement_id, step, content_type, byte_size, data, uploaded_by, created_at) VALUES (:id, :step, :type, :size, :data, :userId, :now)',
          { id, step, type, size: file.size, data: file.buffer, userId: user.id, now: ctx.now().toISOString() },
          t,
        );
      });
      const row = await findOwn(user, id);
      publish(ctx, [row.farm_id, row.apiary_id], 'placement:updated', { placementId: id, agreementId: row.agreement_id, state: row.state, step: 'photo' });
      return toDto(row);
    },

    async photo(user: AuthUser, id: string, photoId: string) {
      await findOwn(user, id);
      const row = await selectOne<{ content_type: string; data: Buffer }>(ctx, 'SELECT content_type, data FROM placement_photos WHERE id = :photoId AND placement_id = :id', { photoId, id });
      if (!row) throw notFound('That photo');
      return row;
    },
  };
}

// Builders for the season's core rows (blocks, bloom windows, yards, hive requests, drop
// sites, commitments, agreements, placements, strength checks), written as plain SQL on
// the core tables so every feature's tests and the seed can use them.
import { QueryTypes, type Sequelize } from 'sequelize';
import type { GeoPolygon } from '../../../shared/schemas/common.js';
import { builderModels, builderSequelize } from './builder-database.js';

const SQUARE_METRES_PER_ACRE = 4046.8564224;

function db(): Sequelize {
  const sequelize = builderSequelize();
  if (!sequelize) throw new Error('models are not initialised: start the test app first');
  return sequelize;
}

async function insert<T>(sql: string, replacements: Record<string, unknown>): Promise<T> {
  const rows = (await db().query(sql, { replacements, type: QueryTypes.SELECT })) as T[];
  return rows[0];
}

type Id = { id: string };
type Org = { id: string };
type Range = { from: Date; to: Date };

/** A square outline of about `acres` acres centred on (lon, lat). */
export function squareOutline(lon: number, lat: number, acres: number): GeoPolygon {
  const side = Math.sqrt(acres * SQUARE_METRES_PER_ACRE);
  const dLat = side / 2 / 111_320;
  const dLon = side / 2 / (111_320 * Math.cos((lat * Math.PI) / 180));
  const ring: Array<[number, number]> = [
    [lon - dLon, lat - dLat], [lon + dLon, lat - dLat], [lon + dLon, lat + dLat], [lon - dLon, lat + dLat], [lon - dLon, lat - dLat],
  ];
  return { type: 'Polygon', coordinates: [ring] };
}

export interface BuiltBlock { id: string; farmId: string; name: string; crop: string; acres: number; lon: number; lat: number }

export async function buildBlock(attrs: {
  farm: Org; name?: string; crop?: string; variety?: string | null; lon?: number; lat?: number; acres?: number;
  withOutline?: boolean; coloniesPerAcre?: number;
}): Promise<BuiltBlock> {
  const lon = attrs.lon ?? -119.9;
  const lat = attrs.lat ?? 44.9;
  const acres = attrs.acres ?? 20;
  const outline = attrs.withOutline === false ? null : JSON.stringify(squareOutline(lon, lat, acres));
  const row = await insert<{ id: string; area_m2: number }>(
    `INSERT INTO blocks (farm_id, name, crop, variety, outline, location, entered_acres, area_m2, colonies_per_acre)
     VALUES (:farmId, :name, :crop, :variety,
       CASE WHEN :outline::text IS NULL THEN NULL ELSE ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326) END,
       ST_SetSRID(ST_MakePoint(:lon, :lat), 4326),
       CASE WHEN :outline::text IS NULL THEN :acres ELSE NULL END,
       CASE WHEN :outline::text IS NULL THEN :acres * ${SQUARE_METRES_PER_ACRE}
            ELSE ST_Area(ST_SetSRID(ST_GeomFromGeoJSON(:outline), 4326)::geography) END,
       :rate)
     RETURNING id, area_m2`,
    {
      farmId: attrs.farm.id, name: attrs.name ?? `Block ${Math.random().toString(36).slice(2, 7)}`, crop: attrs.crop ?? 'apple',
      variety: attrs.variety ?? null, outline, lon, lat, acres, rate: attrs.coloniesPerAcre ?? 2,
    },
  );
  return { id: row.id, farmId: attrs.farm.id, name: attrs.name ?? '', crop: attrs.crop ?? 'apple', acres: row.area_m2 / SQUARE_METRES_PER_ACRE, lon, lat };
}

export async function buildBloomWindow(attrs: { block: Id; season?: number; bloomStart: string; fullBloom?: string | null; petalFall: string; revisedBy?: Id | null; note?: string }) {
  return insert<{ id: string }>(
    `INSERT INTO bloom_windows (block_id, season, bloom_start, full_bloom, petal_fall, confidence_note, revised_by)
     VALUES (:blockId, :season, :bloomStart, :fullBloom, :petalFall, :note, :revisedBy) RETURNING id`,
    {
      blockId: attrs.block.id, season: attrs.season ?? Number(attrs.bloomStart.slice(0, 4)), bloomStart: attrs.bloomStart,
      fullBloom: attrs.fullBloom ?? null, petalFall: attrs.petalFall, note: attrs.note ?? null, revisedBy: attrs.revisedBy?.id ?? null,
    },
  );
}

export async function buildYard(attrs: { apiary: Org; name?: string; lon: number; lat: number; colonies?: number }) {
  return insert<{ id: string }>(
    `INSERT INTO yards (apiary_id, name, location, colonies) VALUES (:apiaryId, :name, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326), :colonies) RETURNING id`,
    { apiaryId: attrs.apiary.id, name: attrs.name ?? 'Home yard', lon: attrs.lon, lat: attrs.lat, colonies: attrs.colonies ?? null },
  );
}

export interface RequestTerms {
  pricePerColonyCents?: number; minFramesOfBees?: number; minFramesOfBrood?: number | null; depositShareBp?: number; balanceDueDays?: number;
  lateInterestBpPerMonth?: number; belowMinimumRateBp?: number; extraMoveFeeCents?: number; noticeHours?: number; currency?: string;
}

export async function buildRequest(attrs: {
  farm: Org; blocks: Array<{ block: Id; colonies: number }>; state?: 'draft' | 'listed' | 'filled' | 'closed' | 'withdrawn';
  title?: string; onSite: Range; createdBy?: Id | null; respondBy?: string | null;
} & RequestTerms) {
  const colonies = attrs.blocks.reduce((sum, b) => sum + b.colonies, 0);
  const row = await insert<{ id: string }>(
    `INSERT INTO hive_requests (farm_id, title, state, colonies_requested, min_frames_of_bees, min_frames_of_brood, arrive_rule, arrive_on,
       depart_rule, depart_on, expected_on_site, price_per_colony_cents, currency, deposit_share_bp, balance_due_days,
       late_interest_bp_per_month, below_minimum_rate_bp, extra_move_fee_cents, notice_hours, respond_by, created_by)
     VALUES (:farmId, :title, :state, :colonies, :minBees, :minBrood, 'date', (:from::timestamptz)::date, 'date', (:to::timestamptz)::date,
       tstzrange(:from, :to, '[)'), :price, :currency, :deposit, :balanceDays, :interest, :belowMin, :moveFee, :notice, :respondBy, :createdBy)
     RETURNING id`,
    {
      farmId: attrs.farm.id, title: attrs.title ?? 'Colonies for bloom', state: attrs.state ?? 'listed', colonies,
      minBees: attrs.minFramesOfBees ?? 6, minBrood: attrs.minFramesOfBrood ?? null, from: attrs.onSite.from.toISOString(), to: attrs.onSite.to.toISOString(),
      price: attrs.pricePerColonyCents ?? 6500, currency: attrs.currency ?? 'USD', deposit: attrs.depositShareBp ?? 5000,
      balanceDays: attrs.balanceDueDays ?? 30, interest: attrs.lateInterestBpPerMonth ?? 100, belowMin: attrs.belowMinimumRateBp ?? 0,
      moveFee: attrs.extraMoveFeeCents ?? 0, notice: attrs.noticeHours ?? 48, respondBy: attrs.respondBy ?? null, createdBy: attrs.createdBy?.id ?? null,
    },
  );
  for (const b of attrs.blocks) {
    await db().query('INSERT INTO hive_request_blocks (request_id, block_id, colonies) VALUES (:requestId, :blockId, :colonies)', {
      replacements: { requestId: row.id, blockId: b.block.id, colonies: b.colonies },
    });
  }
  return { id: row.id, coloniesRequested: colonies };
}

export async function buildDropSite(attrs: { request: Id; block: Id; name?: string; lon: number; lat: number; coloniesPlanned: number; gateCode?: string | null }) {
  return insert<{ id: string }>(
    `INSERT INTO drop_sites (request_id, block_id, name, location, colonies_planned, gate_code, vehicle_access, water_source)
     VALUES (:requestId, :blockId, :name, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326), :colonies, :gate, 'Flatbed truck to the lane end', 'Trough at the pump house') RETURNING id`,
    { requestId: attrs.request.id, blockId: attrs.block.id, name: attrs.name ?? 'North lane', lon: attrs.lon, lat: attrs.lat, colonies: attrs.coloniesPlanned, gate: attrs.gateCode ?? null },
  );
}

export async function buildCommitment(attrs: { request: Id; apiary: Org; colonies: number; state?: 'offered' | 'accepted' | 'declined' | 'withdrawn'; proposedPriceCents?: number | null; createdBy?: Id | null }) {
  return insert<{ id: string }>(
    `INSERT INTO commitments (request_id, apiary_id, colonies, proposed_price_cents, state, created_by) VALUES (:requestId, :apiaryId, :colonies, :price, :state, :createdBy) RETURNING id`,
    { requestId: attrs.request.id, apiaryId: attrs.apiary.id, colonies: attrs.colonies, price: attrs.proposedPriceCents ?? null, state: attrs.state ?? 'accepted', createdBy: attrs.createdBy?.id ?? null },
  );
}

/** An agreement for an accepted commitment, copying the request's terms. */
export async function buildAgreement(attrs: { commitment: Id; state?: 'awaiting-signatures' | 'in-force' | 'completed' | 'cancelled'; farmConfirmedBy?: Id | null; apiaryConfirmedBy?: Id | null; onSite?: Range }) {
  const state = attrs.state ?? 'in-force';
  const signed = state !== 'awaiting-signatures';
  return insert<{ id: string; farm_id: string; apiary_id: string }>(
    `INSERT INTO agreements (commitment_id, request_id, farm_id, apiary_id, state, colonies, price_per_colony_cents, currency, min_frames_of_bees,
       min_frames_of_brood, expected_on_site, notice_hours, deposit_share_bp, balance_due_days, late_interest_bp_per_month, below_minimum_rate_bp,
       extra_move_fee_cents, farm_confirmed_by, farm_confirmed_at, apiary_confirmed_by, apiary_confirmed_at)
     SELECT c.id, r.id, r.farm_id, c.apiary_id, :state, c.colonies, coalesce(c.proposed_price_cents, r.price_per_colony_cents), r.currency,
       r.min_frames_of_bees, r.min_frames_of_brood, CASE WHEN :onSiteFrom::timestamptz IS NULL THEN r.expected_on_site ELSE tstzrange(:onSiteFrom::timestamptz, :onSiteTo::timestamptz, '[)') END, r.notice_hours, r.deposit_share_bp,
       r.balance_due_days, r.late_interest_bp_per_month, r.below_minimum_rate_bp, r.extra_move_fee_cents,
       :farmBy, CASE WHEN :signed THEN now() END, :apiaryBy, CASE WHEN :signed THEN now() END
     FROM commitments c JOIN hive_requests r ON r.id = c.request_id WHERE c.id = :commitmentId
     RETURNING id, farm_id, apiary_id`,
    {
      commitmentId: attrs.commitment.id, state, signed,
      onSiteFrom: attrs.onSite?.from.toISOString() ?? null, onSiteTo: attrs.onSite?.to.toISOString() ?? null,
      farmBy: attrs.farmConfirmedBy?.id ?? null, apiaryBy: attrs.apiaryConfirmedBy?.id ?? null,
    },
  );
}

/** A placement; delivered/picked-up times set the on_site range the conflict search reads. */
export async function buildPlacement(attrs: {
  agreement: Id; dropSite: Id; coloniesPlanned: number; state?: 'scheduled' | 'delivered' | 'picked-up';
  deliveredAt?: Date; pickedUpAt?: Date; coloniesDelivered?: number; coloniesPickedUp?: number;
}) {
  const state = attrs.state ?? (attrs.pickedUpAt ? 'picked-up' : attrs.deliveredAt ? 'delivered' : 'scheduled');
  return insert<{ id: string }>(
    `INSERT INTO placements (agreement_id, drop_site_id, state, colonies_planned, on_site, colonies_delivered, delivered_at, delivered_location,
       colonies_picked_up, picked_up_at)
     SELECT a.id, d.id, :state, :planned,
       CASE WHEN :deliveredAt::timestamptz IS NULL THEN a.expected_on_site
            ELSE tstzrange(:deliveredAt::timestamptz, :pickedUpAt::timestamptz, '[)') END,
       :delivered, :deliveredAt, CASE WHEN :deliveredAt::timestamptz IS NULL THEN NULL ELSE d.location END, :pickedUp, :pickedUpAt
     FROM agreements a, drop_sites d WHERE a.id = :agreementId AND d.id = :dropSiteId
     RETURNING id`,
    {
      agreementId: attrs.agreement.id, dropSiteId: attrs.dropSite.id, state, planned: attrs.coloniesPlanned,
      deliveredAt: attrs.deliveredAt?.toISOString() ?? null, pickedUpAt: attrs.pickedUpAt?.toISOString() ?? null,
      delivered: attrs.coloniesDelivered ?? (attrs.deliveredAt ? attrs.coloniesPlanned : null),
      pickedUp: attrs.coloniesPickedUp ?? (attrs.pickedUpAt ? (attrs.coloniesDelivered ?? attrs.coloniesPlanned) : null),
    },
  );
}

export async function buildStrengthCheck(attrs: { placement: Id; coloniesInGroup: number; framesOfBees: number[]; framesOfBrood?: number[] | null; checkedAt?: Date; checkedBy?: Id | null }) {
  // The model writes the frame counts as a double precision[] itself.
  const check = await builderModels().StrengthCheck.create({
    placementId: attrs.placement.id, checkedAt: attrs.checkedAt ?? new Date(), checkedBy: attrs.checkedBy?.id ?? null, inspectorName: null,
    coloniesInGroup: attrs.coloniesInGroup, framesOfBees: attrs.framesOfBees, framesOfBrood: attrs.framesOfBrood ?? null, notes: null, recordedAt: null,
  });
  return { id: check.id };
}

/**
 * One signed season on one block: a farm's block in bloom, a listed request, a drop site
 * at the block, an apiary's accepted commitment, an agreement in force and a placement
 * (delivered unless told otherwise). Pass existing organizations to reuse them.
 */
export async function buildSignedSeason(attrs: {
  farm: Org; apiary: Org; lon?: number; lat?: number; colonies?: number; onSite: Range; delivered?: boolean; bloom?: { bloomStart: string; petalFall: string };
} & RequestTerms) {
  const lon = attrs.lon ?? -119.9;
  const lat = attrs.lat ?? 44.9;
  const colonies = attrs.colonies ?? 40;
  const block = await buildBlock({ farm: attrs.farm, lon, lat, acres: colonies / 2 });
  if (attrs.bloom) await buildBloomWindow({ block, ...attrs.bloom });
  const { farm, apiary: _apiary, lon: _lon, lat: _lat, colonies: _colonies, delivered: _delivered, bloom: _bloom, onSite, ...terms } = attrs;
  const request = await buildRequest({ farm, blocks: [{ block, colonies }], state: 'filled', onSite, ...terms });
  const dropSite = await buildDropSite({ request, block, lon, lat, coloniesPlanned: colonies });
  const commitment = await buildCommitment({ request, apiary: attrs.apiary, colonies });
  const agreement = await buildAgreement({ commitment });
  const placement = await buildPlacement({
    agreement, dropSite, coloniesPlanned: colonies,
    ...(attrs.delivered === false ? {} : { deliveredAt: attrs.onSite.from }),
  });
  return { block, request, dropSite, commitment, agreement, placement };
}

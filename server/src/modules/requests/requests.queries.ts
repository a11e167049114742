// The searches over hive requests the ORM cannot say well: the summary of each request
// with its committed colonies, crops and (for a beekeeper) the PostGIS distance from the
// apiary's nearest yard, filtered by crop and by tstzrange overlap, ordered by distance.
// The request list is read on most pages: each combination of filters is one prepared
// statement (planned once per connection), values as bind parameters.
import type { Sequelize, Transaction } from 'sequelize';
import { queryPrepared, statementFor } from '../../db/query-rows.js';
import type { RequestState } from '../../../../shared/schemas/requests.js';

export type RequestSummaryRow = {
  id: string; farm_id: string; farm_name: string; title: string; state: RequestState; colonies_requested: number; committed: number;
  crops: string[] | null; min_frames_of_bees: number; min_frames_of_brood: number | null; on_site_from: Date | null; on_site_to: Date | null;
  price_per_colony_cents: number; currency: string; respond_by: string | null; distance_km: number | null;
};

export interface RequestSearch {
  /** The organization asking: a farm sees its own requests, an apiary the open ones and those it committed to. */
  organizationId: string;
  isApiary: boolean;
  id?: string;
  crop?: string;
  /** Calendar days (YYYY-MM-DD): the expected time on site overlaps [from, to]. */
  from?: string;
  to?: string;
  maxDistanceKm?: number;
}

// Distance from the apiary's nearest yard to the nearest drop site or block of the request.
const distanceFromYards = `(SELECT min(ST_Distance(y.location::geography, t.geom::geography)) / 1000
  FROM yards y CROSS JOIN (
    SELECT d.location AS geom FROM drop_sites d WHERE d.request_id = r.id
    UNION ALL
    SELECT coalesce(b.location, ST_Centroid(b.outline)) FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id
  ) t WHERE y.apiary_id = $org::uuid AND t.geom IS NOT NULL)`;

/** Requests a beekeeper may see: open ones, and any it has committed to. */
const apiaryVisible = `(r.state IN ('listed', 'filled') OR EXISTS (SELECT 1 FROM commitments c WHERE c.request_id = r.id AND c.apiary_id = $org::uuid))`;

export function requestSummaries(sequelize: Sequelize, search: RequestSearch, transaction?: Transaction): Promise<RequestSummaryRow[]> {
  const where = [search.isApiary ? apiaryVisible : 'r.farm_id = $org::uuid'];
  if (search.id) where.push('r.id = $id::uuid');
  if (search.crop) where.push('EXISTS (SELECT 1 FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id AND b.crop = $crop::text)');
  if (search.from) where.push('r.expected_on_site && tstzrange($from::date::timestamptz, NULL)');
  if (search.to) where.push('r.expected_on_site && tstzrange(NULL, ($to::date + 1)::timestamptz)');
  const nearEnough = search.isApiary && search.maxDistanceKm ? 'WHERE q.distance_km <= $maxDistanceKm::float8' : '';
  return queryPrepared<RequestSummaryRow>(
    sequelize,
    statementFor('request-summaries', `SELECT * FROM (
       SELECT r.id, r.farm_id, o.name AS farm_name, r.title, r.state, r.colonies_requested,
         (SELECT coalesce(sum(c.colonies), 0)::int FROM commitments c WHERE c.request_id = r.id AND c.state IN ('offered', 'accepted')) AS committed,
         (SELECT array_agg(DISTINCT b.crop ORDER BY b.crop) FROM hive_request_blocks hb JOIN blocks b ON b.id = hb.block_id WHERE hb.request_id = r.id) AS crops,
         r.min_frames_of_bees, r.min_frames_of_brood, lower(r.expected_on_site) AS on_site_from, upper(r.expected_on_site) AS on_site_to,
         r.price_per_colony_cents, r.currency, to_char(r.respond_by, 'YYYY-MM-DD') AS respond_by,
         ${search.isApiary ? distanceFromYards : 'NULL::double precision'} AS distance_km
       FROM hive_requests r JOIN organizations o ON o.id = r.farm_id
       WHERE ${where.join(' AND ')}) q
     ${nearEnough}
     ORDER BY ${search.isApiary ? 'q.distance_km NULLS LAST,' : ''} q.on_site_from NULLS LAST, q.title, q.id`),
    {
      org: search.organizationId, id: search.id ?? null, crop: search.crop ?? null, from: search.from ?? null, to: search.to ?? null,
      maxDistanceKm: search.maxDistanceKm ?? null,
    },
    transaction,
  );
}

// The ids of what one organization owns or takes part in, by the kind of object a route
// names (the path segment before an id, e.g. /api/blocks/:id -> blocks), for tests that go
// over every route with real ids.
import { QueryTypes, type Sequelize } from 'sequelize';

/** One SQL per kind of object; :org is the organization (a farm or an apiary business). */
const ownedBy: Record<string, string> = {
  blocks: 'SELECT id FROM blocks WHERE farm_id = :org',
  stations: 'SELECT id FROM weather_stations WHERE farm_id = :org',
  'stage-thresholds': 'SELECT id FROM crop_stage_thresholds WHERE farm_id = :org',
  requests: 'SELECT id FROM hive_requests WHERE farm_id = :org UNION SELECT request_id FROM commitments WHERE apiary_id = :org',
  yards: 'SELECT id FROM yards WHERE apiary_id = :org',
  commitments: 'SELECT c.id FROM commitments c JOIN hive_requests r ON r.id = c.request_id WHERE c.apiary_id = :org OR r.farm_id = :org',
  agreements: 'SELECT id FROM agreements WHERE farm_id = :org OR apiary_id = :org',
  amendments: 'SELECT m.id FROM agreement_amendments m JOIN agreements a ON a.id = m.agreement_id WHERE a.farm_id = :org OR a.apiary_id = :org',
  placements: 'SELECT p.id FROM placements p JOIN agreements a ON a.id = p.agreement_id WHERE a.farm_id = :org OR a.apiary_id = :org',
  photos: 'SELECT f.id FROM placement_photos f JOIN placements p ON p.id = f.placement_id JOIN agreements a ON a.id = p.agreement_id WHERE a.farm_id = :org OR a.apiary_id = :org',
  invitations: 'SELECT id FROM invitations WHERE organization_id = :org',
  sprays: 'SELECT id FROM spray_plans WHERE farm_id = :org',
  alerts: 'SELECT id FROM alerts WHERE farm_id = :org OR apiary_id = :org',
  invoices: 'SELECT id FROM invoices WHERE farm_id = :org OR apiary_id = :org',
  payments: 'SELECT p.id FROM payments p JOIN invoices i ON i.id = p.invoice_id WHERE i.farm_id = :org OR i.apiary_id = :org',
};

export type OwnedIds = Record<string, string[]>;

export async function ownedIds(sequelize: Sequelize, organizationId: string): Promise<OwnedIds> {
  const out: OwnedIds = {};
  for (const [kind, sql] of Object.entries(ownedBy)) {
    const rows = await sequelize.query<{ id: string }>(`${sql} ORDER BY 1`, { replacements: { org: organizationId }, type: QueryTypes.SELECT });
    out[kind] = rows.map((r) => r.id);
  }
  return out;
}

/** The kind of object a path parameter names: the segment before it, or the parameter's own name (photoId -> photos). */
export function kindOfParam(path: string, param: string): string {
  if (param !== 'id') return `${param.replace(/Id$/, '')}s`;
  const segments = path.split('/');
  const at = segments.indexOf(`:${param}`);
  return segments[at - 1] ?? '';
}

/** Field names whose kind is named differently in the routes, or is not an object of ours. */
const fieldKinds: Record<string, string | null> = { weatherStations: 'stations', providerPayments: null, pestModels: null };

/** The kind of object a body or query field names: blockId / blockIds -> blocks, stationId -> stations. */
export function kindOfField(field: string): string | null {
  const m = /^(.+?)Ids?$/.exec(field);
  if (!m) return null;
  const kind = `${m[1]}s`;
  return fieldKinds[kind] === undefined ? kind : fieldKinds[kind];
}

// What an organization's calendar feed shows, read across features in one place: its
// agreements' windows, its open requests, delivered and picked-up placements with their
// drop site's position, and spray windows (its own, or those alerting it). Ranges come out
// as their two bounds.
import type { Sequelize } from 'sequelize';
import { queryRows } from '../../db/query-rows.js';

export type FeedAgreementRow = { id: string; title: string; other: string; colonies: number; from: Date | null; to: Date | null; state: string };
export type FeedRequestRow = { id: string; title: string; colonies_requested: number; from: Date | null; to: Date | null };
export type FeedPlacementRow = {
  id: string; site: string; colonies_delivered: number | null; delivered_at: Date | null; colonies_picked_up: number | null; picked_up_at: Date | null; lon: number; lat: number;
};
export type FeedSprayRow = { id: string; product_name: string; state: string; from: Date | null; to: Date | null; blocks: string | null };

export function feedAgreements(sequelize: Sequelize, org: string) {
  return queryRows<FeedAgreementRow>(
    sequelize,
    `SELECT a.id, r.title, CASE WHEN a.farm_id = $org THEN ao.name ELSE fo.name END AS other, a.colonies,
       lower(a.expected_on_site) AS "from", upper(a.expected_on_site) AS "to", a.state
     FROM agreements a JOIN hive_requests r ON r.id = a.request_id JOIN organizations fo ON fo.id = a.farm_id JOIN organizations ao ON ao.id = a.apiary_id
     WHERE (a.farm_id = $org OR a.apiary_id = $org) AND a.state IN ('awaiting-signatures', 'in-force', 'completed')`,
    { bind: { org } },
  );
}

/** A farm's requests still open for commitments and not yet under any agreement. */
export function feedOpenRequests(sequelize: Sequelize, org: string) {
  return queryRows<FeedRequestRow>(
    sequelize,
    `SELECT r.id, r.title, r.colonies_requested, lower(r.expected_on_site) AS "from", upper(r.expected_on_site) AS "to"
     FROM hive_requests r
     WHERE r.farm_id = $org AND r.state IN ('listed', 'filled') AND NOT EXISTS (SELECT 1 FROM agreements a WHERE a.request_id = r.id AND a.state <> 'cancelled')`,
    { bind: { org } },
  );
}

export function feedPlacements(sequelize: Sequelize, org: string) {
  return queryRows<FeedPlacementRow>(
    sequelize,
    `SELECT p.id, d.name AS site, p.colonies_delivered, p.delivered_at, p.colonies_picked_up, p.picked_up_at, ST_X(d.location) AS lon, ST_Y(d.location) AS lat
     FROM placements p JOIN agreements a ON a.id = p.agreement_id JOIN drop_sites d ON d.id = p.drop_site_id
     WHERE (a.farm_id = $org OR a.apiary_id = $org) AND p.delivered_at IS NOT NULL`,
    { bind: { org } },
  );
}

/** Spray windows (with their residual time): a farm's own, and for an apiary business those that raised an alert for it and are not resolved. */
export function feedSprays(sequelize: Sequelize, org: string) {
  return queryRows<FeedSprayRow>(
    sequelize,
    `SELECT s.id, s.product_name, s.state, lower(s.exposure_window) AS "from", upper(s.exposure_window) AS "to",
       (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
     FROM spray_plans s
     WHERE s.state <> 'cancelled' AND (s.farm_id = $org
       OR EXISTS (SELECT 1 FROM alerts al WHERE al.spray_plan_id = s.id AND al.apiary_id = $org AND al.state <> 'resolved'))`,
    { bind: { org } },
  );
}

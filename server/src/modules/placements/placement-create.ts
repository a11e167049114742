// Placements for an agreement once both sides confirm it: its colonies are spread over
// the request's drop sites in order, each filled up to its planned colonies less what
// other agreements already place there; anything left goes to the last site. Until
// delivery a placement is expected on site for the agreement's window.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { selectOne, selectRows } from '../requests/sql.js';

export async function createPlacementsForAgreement(ctx: AppContext, agreementId: string, t: Transaction): Promise<string[]> {
  const agreement = (await selectOne<{ request_id: string; colonies: number }>(ctx, 'SELECT request_id, colonies FROM agreements WHERE id = :agreementId', { agreementId }, t))!;
  const sites = await selectRows<{ id: string; colonies_planned: number; taken: string }>(
    ctx,
    `SELECT d.id, d.colonies_planned,
       (SELECT coalesce(sum(p.colonies_planned), 0) FROM placements p JOIN agreements a ON a.id = p.agreement_id
        WHERE p.drop_site_id = d.id AND a.state IN ('in-force', 'completed')) AS taken
     FROM drop_sites d WHERE d.request_id = :requestId ORDER BY d.created_at, d.name, d.id`,
    { requestId: agreement.request_id },
    t,
  );
  const shares = new Map<string, number>();
  let left = agreement.colonies;
  for (const site of sites) {
    const share = Math.min(left, Math.max(0, site.colonies_planned - Number(site.taken)));
    if (share > 0) shares.set(site.id, share);
    left -= share;
  }
  if (left > 0 && sites.length) shares.set(sites.at(-1)!.id, (shares.get(sites.at(-1)!.id) ?? 0) + left);
  const ids: string[] = [];
  for (const [siteId, colonies] of shares) {
    const row = await selectOne<{ id: string }>(
      ctx,
      `INSERT INTO placements (agreement_id, drop_site_id, state, colonies_planned, on_site)
       SELECT :agreementId, :siteId, 'scheduled', :colonies, expected_on_site FROM agreements WHERE id = :agreementId RETURNING id`,
      { agreementId, siteId, colonies },
      t,
    );
    ids.push(row!.id);
  }
  return ids;
}

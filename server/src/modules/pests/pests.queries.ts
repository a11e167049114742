// What a block's suggested spray days are marked against, in PostgreSQL: its bloom window of
// the season and the stretches colonies are (or are agreed to be) on its drop sites, as local
// calendar days in the farm's time zone (tstzrange bounds read AT TIME ZONE).
import type { Sequelize } from 'sequelize';
import { queryOne, queryRows } from '../../db/query-rows.js';
import type { DayRange } from '../../../../shared/domain/spray-windows.js';

const localDays = (range: string) => `to_char(lower(${range}) AT TIME ZONE $timeZone, 'YYYY-MM-DD') AS "from",
  to_char(CASE WHEN upper_inf(${range}) THEN lower(${range}) + interval '1 year' ELSE upper(${range}) - interval '1 microsecond' END AT TIME ZONE $timeZone, 'YYYY-MM-DD') AS "to"`;

export async function sprayDayContext(sequelize: Sequelize, blockId: string, timeZone: string, season: number): Promise<{ bloom: DayRange | null; coloniesOnSite: DayRange[] }> {
  const bloom = await queryOne<DayRange>(
    sequelize,
    `SELECT to_char(bloom_start, 'YYYY-MM-DD') AS "from", to_char(petal_fall, 'YYYY-MM-DD') AS "to" FROM current_bloom_windows WHERE block_id = $blockId AND season = $season`,
    { bind: { blockId, season } },
  );
  const coloniesOnSite = await queryRows<DayRange>(
    sequelize,
    `SELECT ${localDays('p.on_site')} FROM placements p JOIN drop_sites d ON d.id = p.drop_site_id JOIN agreements a ON a.id = p.agreement_id
     WHERE d.block_id = $blockId AND (p.state <> 'scheduled' OR a.state IN ('awaiting-signatures', 'in-force'))
     UNION ALL
     -- Agreed but not yet scheduled: the agreement's window at its request's drop sites on this block.
     SELECT ${localDays('a.expected_on_site')} FROM agreements a JOIN drop_sites d ON d.request_id = a.request_id
     WHERE d.block_id = $blockId AND a.state IN ('awaiting-signatures', 'in-force') AND NOT EXISTS (SELECT 1 FROM placements p WHERE p.agreement_id = a.id)`,
    { bind: { blockId, timeZone } },
  );
  return { bloom: bloom ?? null, coloniesOnSite };
}

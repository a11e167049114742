// Bloom's raw SQL: which apiary businesses follow which blocks (a union over commitments
// and agreements of requests that include the block), the digest mark's forward-only
// upsert, and inserting the published reference rows (run by migrations too, which use no models).
import type { Sequelize, Transaction } from 'sequelize';
import { execute, queryRows } from '../../db/query-rows.js';

/** Apiaries holding an agreement (not cancelled) or an offered/accepted commitment on a request including the block. */
const followsBlock = `
  SELECT c.apiary_id, hrb.block_id FROM commitments c JOIN hive_request_blocks hrb ON hrb.request_id = c.request_id
  WHERE c.state IN ('offered', 'accepted')
  UNION
  SELECT a.apiary_id, hrb.block_id FROM agreements a JOIN hive_request_blocks hrb ON hrb.request_id = a.request_id
  WHERE a.state <> 'cancelled'`;

export async function apiariesFollowingBlock(sequelize: Sequelize, blockId: string, transaction?: Transaction): Promise<string[]> {
  const rows = await queryRows<{ apiary_id: string }>(
    sequelize,
    `SELECT DISTINCT apiary_id FROM (${followsBlock}) f WHERE block_id = :blockId ORDER BY apiary_id`,
    { replacements: { blockId }, transaction },
  );
  return rows.map((r) => r.apiary_id);
}

export async function blocksFollowedBy(sequelize: Sequelize, apiaryId: string): Promise<string[]> {
  const rows = await queryRows<{ block_id: string }>(
    sequelize,
    `SELECT DISTINCT block_id FROM (${followsBlock}) f WHERE apiary_id = :apiaryId`,
    { replacements: { apiaryId } },
  );
  return rows.map((r) => r.block_id);
}

/** Moves the apiary's digest mark forward to `through` (never back: two digests may finish in either order). */
export async function advanceDigestMark(sequelize: Sequelize, apiaryId: string, through: Date): Promise<void> {
  await execute(
    sequelize,
    `INSERT INTO bloom_digest_marks (apiary_id, reported_through) VALUES (:apiaryId, :through)
     ON CONFLICT (apiary_id) DO UPDATE SET reported_through = GREATEST(bloom_digest_marks.reported_through, EXCLUDED.reported_through)`,
    { replacements: { apiaryId, through: through.toISOString() } },
  );
}

/** crop, stage key, label, order, base °F, low and high end (DD°F), source */
export type StageRow = [string, string, string, number, number, number, number, string];
/** crop, stage label, stage key, 10% kill °F, 90% kill °F */
export type FrostRow = [string, string, string | null, number, number];

/** Inserts reference rows; rows already there (perhaps edited) are left alone. */
export async function insertReferenceRows(sequelize: Sequelize, stageRows: readonly StageRow[], frostRows: readonly FrostRow[], frostSource: string): Promise<void> {
  for (const [crop, stage, label, sortOrder, baseF, ddLowF, ddHighF, source] of stageRows) {
    await execute(
      sequelize,
      `INSERT INTO crop_stage_thresholds (crop, stage, label, sort_order, base_f, dd_low_f, dd_high_f, source)
       VALUES (:crop, :stage, :label, :sortOrder, :baseF, :ddLowF, :ddHighF, :source) ON CONFLICT DO NOTHING`,
      { replacements: { crop, stage, label, sortOrder, baseF, ddLowF, ddHighF, source } },
    );
  }
  for (const [index, [crop, label, stage, kill10, kill90]] of frostRows.entries()) {
    await execute(
      sequelize,
      `INSERT INTO frost_critical_temperatures (crop, stage_label, stage, sort_order, kill10_f, kill90_f, source)
       VALUES (:crop, :label, :stage, :sortOrder, :kill10, :kill90, :source) ON CONFLICT DO NOTHING`,
      { replacements: { crop, label, stage, sortOrder: index, kill10, kill90, source: frostSource } },
    );
  }
}

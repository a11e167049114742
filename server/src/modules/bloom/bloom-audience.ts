// Which apiary businesses follow a block's bloom window: those holding an agreement (not
// cancelled) or an open or accepted commitment on a hive request that includes the block.
import { QueryTypes, type Sequelize } from 'sequelize';

export const followingApiariesSql = `
  SELECT c.apiary_id FROM commitments c JOIN hive_request_blocks hrb ON hrb.request_id = c.request_id
  WHERE hrb.block_id = b.id AND c.state IN ('offered', 'accepted')
  UNION
  SELECT a.apiary_id FROM agreements a JOIN hive_request_blocks hrb ON hrb.request_id = a.request_id
  WHERE hrb.block_id = b.id AND a.state <> 'cancelled'`;

export async function apiariesFollowingBlock(sequelize: Sequelize, blockId: string): Promise<string[]> {
  const rows = await sequelize.query<{ apiary_id: string }>(
    `SELECT DISTINCT apiary_id FROM blocks b, LATERAL (${followingApiariesSql}) f WHERE b.id = :blockId`,
    { replacements: { blockId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.apiary_id);
}

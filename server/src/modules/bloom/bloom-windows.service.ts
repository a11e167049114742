// Bloom windows: the grower publishes and revises a block's expected start of bloom, full
// bloom and petal fall; every revision is kept with who and when. Each revision is sent
// live to the farm and to every apiary following the block, and gathered into those
// apiaries' e-mail digest.
import { QueryTypes } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { BloomWindowDto, bloomWindowBody } from '../../../../shared/schemas/blocks.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import { queueNames } from '../../jobs/queue-names.js';
import { notFound } from '../../errors/http-errors.js';
import { toBloomWindowDto, type BloomWindowRow } from '../blocks/block-rows.js';
import { apiariesFollowingBlock, followingApiariesSql } from './bloom-audience.js';
import { bloomWindowChanged } from '../conflicts/conflict-triggers.js';

const windowSelect = `
  SELECT w.id, w.block_id, w.season, to_char(w.bloom_start, 'YYYY-MM-DD') AS bloom_start, to_char(w.full_bloom, 'YYYY-MM-DD') AS full_bloom,
    to_char(w.petal_fall, 'YYYY-MM-DD') AS petal_fall, w.confidence_note, w.revised_by, u.name AS revised_by_name, w.created_at`;

export function createBloomWindowsService(ctx: AppContext) {
  const { sequelize } = ctx;

  async function blockOfFarm(farmId: string, blockId: string) {
    const [block] = await sequelize.query<{ id: string; name: string; crop: string; farm_id: string; farm_name: string }>(
      'SELECT b.id, b.name, b.crop, b.farm_id, o.name AS farm_name FROM blocks b JOIN organizations o ON o.id = b.farm_id WHERE b.id = :blockId AND b.farm_id = :farmId',
      { replacements: { blockId, farmId }, type: QueryTypes.SELECT },
    );
    if (!block) throw notFound('That block');
    return block;
  }

  return {
    /** Every revision, oldest first. */
    async revisions(farmId: string, blockId: string): Promise<BloomWindowDto[]> {
      await blockOfFarm(farmId, blockId);
      const rows = await sequelize.query<BloomWindowRow>(
        `${windowSelect} FROM bloom_windows w LEFT JOIN users u ON u.id = w.revised_by WHERE w.block_id = :blockId ORDER BY w.season, w.created_at, w.id`,
        { replacements: { blockId }, type: QueryTypes.SELECT },
      );
      return rows.map(toBloomWindowDto);
    },

    async publish(user: AuthUser, blockId: string, body: z.output<typeof bloomWindowBody>): Promise<BloomWindowDto> {
      const block = await blockOfFarm(user.organizationId!, blockId);
      const season = body.season ?? Number(body.bloomStart.slice(0, 4));
      const [previous] = await sequelize.query<BloomWindowRow>(
        `${windowSelect} FROM current_bloom_windows w LEFT JOIN users u ON u.id = w.revised_by WHERE w.block_id = :blockId AND w.season = :season`,
        { replacements: { blockId, season }, type: QueryTypes.SELECT },
      );
      // Revisions are ordered by created_at: take the later of now and just after the previous one.
      const [{ id }] = await sequelize.query<{ id: string }>(
        `INSERT INTO bloom_windows (block_id, season, bloom_start, full_bloom, petal_fall, confidence_note, revised_by, created_at)
         VALUES (:blockId, :season, :bloomStart, :fullBloom, :petalFall, :note, :userId,
           GREATEST(:now::timestamptz, (SELECT max(created_at) + interval '1 millisecond' FROM bloom_windows WHERE block_id = :blockId)))
         RETURNING id`,
        {
          replacements: {
            blockId, season, bloomStart: body.bloomStart, fullBloom: body.fullBloom ?? null, petalFall: body.petalFall,
            note: body.confidenceNote ?? null, userId: user.id, now: ctx.now().toISOString(),
          },
          type: QueryTypes.SELECT,
        },
      );
      const [row] = await sequelize.query<BloomWindowRow>(`${windowSelect} FROM bloom_windows w LEFT JOIN users u ON u.id = w.revised_by WHERE w.id = :id`, {
        replacements: { id }, type: QueryTypes.SELECT,
      });
      const window = toBloomWindowDto(row);
      const apiaries = await apiariesFollowingBlock(sequelize, blockId);
      publishToOrganizations(ctx.io, [block.farm_id, ...apiaries], 'bloom:revised', {
        blockId, blockName: block.name, farmId: block.farm_id, farmName: block.farm_name, crop: block.crop, window,
        previous: previous ? { bloomStart: previous.bloom_start, fullBloom: previous.full_bloom, petalFall: previous.petal_fall } : null,
      });
      for (const apiaryId of apiaries) {
        // The digest runs after a delay and reports every revision since the apiary's last
        // digest, so revisions made meanwhile share one e-mail and later jobs find nothing new.
        await ctx.jobs.send(queueNames.bloomDigest, { apiaryId }, { startAfter: ctx.config.bloomDigestDelaySeconds, retryLimit: 5, retryDelay: 30 });
      }
      await bloomWindowChanged(ctx, blockId); // the spray conflict check reads bloom windows
      return window;
    },

    /** For an apiary: the current bloom windows of blocks it follows. */
    async heldWindows(apiaryId: string) {
      const rows = await sequelize.query<BloomWindowRow & { block_name: string; crop: string; farm_name: string }>(
        `${windowSelect}, b.name AS block_name, b.crop, o.name AS farm_name
         FROM blocks b JOIN organizations o ON o.id = b.farm_id
         JOIN current_bloom_windows w ON w.block_id = b.id LEFT JOIN users u ON u.id = w.revised_by
         WHERE :apiaryId IN (${followingApiariesSql})
         ORDER BY w.bloom_start, b.name`,
        { replacements: { apiaryId }, type: QueryTypes.SELECT },
      );
      return rows.map((r) => ({ ...toBloomWindowDto(r), blockName: r.block_name, crop: r.crop, farmName: r.farm_name }));
    },
  };
}

export type BloomWindowsService = ReturnType<typeof createBloomWindowsService>;

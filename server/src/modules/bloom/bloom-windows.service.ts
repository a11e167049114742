// Bloom windows: the grower publishes and revises a block's expected start of bloom, full
// bloom and petal fall; every revision is kept with who and when. Each revision is sent
// live to the farm and to every apiary following the block, and gathered into those
// apiaries' e-mail digest.
import type { Transaction } from 'sequelize';
import type { z } from 'zod';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { BloomWindowDto, bloomWindowBody } from '../../../../shared/schemas/blocks.js';
import type { BloomWindow } from '../../db/models/bloom-window.model.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import { queueNames } from '../../jobs/queue-names.js';
import { notFound } from '../../errors/http-errors.js';
import { toBloomWindowDto } from '../blocks/block-dto.js';
import { apiariesFollowingBlock, blocksFollowedBy } from './bloom.queries.js';
import { bloomWindowChanged } from '../alerts/conflict-rechecks.js';

export function createBloomWindowsService(ctx: AppContext) {
  const { sequelize } = ctx;
  const { Block, BloomWindow, Organization, User } = ctx.models;
  const withReviser = [{ model: User, as: 'reviser', attributes: ['name'] }];
  const latestFirst: Array<[string, string]> = [['createdAt', 'DESC'], ['id', 'DESC']];

  async function blockOfFarm(farmId: string, blockId: string, transaction?: Transaction) {
    const block = await Block.findOne({
      where: { id: blockId, farmId },
      include: [{ model: Organization, as: 'farm', attributes: ['name'] }],
      transaction,
      lock: transaction ? { level: transaction.LOCK.UPDATE, of: Block } : undefined,
    });
    if (!block) throw notFound('That block');
    return block;
  }

  return {
    /** Every revision, oldest first. */
    async revisions(farmId: string, blockId: string): Promise<BloomWindowDto[]> {
      await blockOfFarm(farmId, blockId);
      const rows = await BloomWindow.findAll({ where: { blockId }, include: withReviser, order: [['season', 'ASC'], ['createdAt', 'ASC'], ['id', 'ASC']] });
      return rows.map(toBloomWindowDto);
    },

    async publish(user: AuthUser, blockId: string, body: z.output<typeof bloomWindowBody>): Promise<BloomWindowDto> {
      const season = body.season ?? Number(body.bloomStart.slice(0, 4));
      // The block row is locked so revisions of one block are stored one after the other.
      // The spray conflict check reads bloom windows: its re-check is queued in the same transaction.
      const { block, previous, id } = await sequelize.transaction(async (transaction) => {
        const block = await blockOfFarm(user.organizationId!, blockId, transaction);
        const previous = await BloomWindow.findOne({ where: { blockId, season }, order: latestFirst, transaction });
        // Revisions are ordered by createdAt: take the later of now and just after the previous one.
        const last = await BloomWindow.max<Date | null, BloomWindow>('createdAt', { where: { blockId }, transaction });
        const createdAt = new Date(Math.max(ctx.now().getTime(), last ? new Date(last).getTime() + 1 : 0));
        const created = await BloomWindow.create({
          blockId, season, bloomStart: body.bloomStart, fullBloom: body.fullBloom ?? null, petalFall: body.petalFall,
          confidenceNote: body.confidenceNote ?? null, revisedBy: user.id, createdAt,
        }, { transaction });
        await bloomWindowChanged(ctx, transaction, blockId);
        return { block, previous, id: created.id };
      });
      const window = toBloomWindowDto((await BloomWindow.findByPk(id, { include: withReviser }))!);
      const apiaries = await apiariesFollowingBlock(sequelize, blockId);
      publishToOrganizations(ctx.io, [block.farmId, ...apiaries], 'bloom:revised', {
        blockId, blockName: block.name, farmId: block.farmId, farmName: block.farm!.name, crop: block.crop, window,
        previous: previous ? { bloomStart: previous.bloomStart, fullBloom: previous.fullBloom, petalFall: previous.petalFall } : null,
      });
      for (const apiaryId of apiaries) {
        // The digest runs after a delay and reports every revision since the apiary's last
        // digest, so revisions made meanwhile share one e-mail and later jobs find nothing new.
        await ctx.jobs.send(queueNames.bloomDigest, { apiaryId }, { startAfter: ctx.config.bloomDigestDelaySeconds, retryLimit: 5, retryDelay: 30 });
      }
      return window;
    },

    /** For an apiary: the current bloom window of each season of the blocks it follows. */
    async heldWindows(apiaryId: string) {
      const blockIds = await blocksFollowedBy(sequelize, apiaryId);
      if (!blockIds.length) return [];
      const windows = await BloomWindow.findAll({
        where: { blockId: blockIds },
        include: [...withReviser, { model: Block, as: 'block', attributes: ['name', 'crop'], include: [{ model: Organization, as: 'farm', attributes: ['name'] }] }],
        order: latestFirst,
      });
      const current = new Map<string, BloomWindow>();
      for (const w of windows) if (!current.has(`${w.blockId}/${w.season}`)) current.set(`${w.blockId}/${w.season}`, w);
      return [...current.values()]
        .sort((a, b) => a.bloomStart.localeCompare(b.bloomStart) || a.block!.name.localeCompare(b.block!.name))
        .map((w) => ({ ...toBloomWindowDto(w), blockName: w.block!.name, crop: w.block!.crop, farmName: w.block!.farm!.name }));
    },
  };
}

export type BloomWindowsService = ReturnType<typeof createBloomWindowsService>;

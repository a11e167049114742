// The e-mail digest of bloom-window revisions for one apiary business: every revision on
// a block it follows since its last digest, to its owners and managers.
import { Op } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { advanceDigestMark, blocksFollowedBy } from './bloom.queries.js';
import { DateTime } from 'luxon';
import { cropSet } from '../../../../shared/labels/crops.js';
import { labelOf } from '../../../../shared/labels/label-set.js';

const day = (iso: string) => DateTime.fromISO(iso).toFormat('ccc d LLL yyyy');

export async function sendBloomDigest(ctx: AppContext, apiaryId: string): Promise<number> {
  const { Block, BloomDigestMark, BloomWindow, Organization, User } = ctx.models;
  const mark = await BloomDigestMark.findByPk(apiaryId);
  const blockIds = await blocksFollowedBy(ctx.sequelize, apiaryId);
  if (!blockIds.length) return 0;
  const revisions = await BloomWindow.findAll({
    where: { blockId: blockIds, ...(mark ? { createdAt: { [Op.gt]: mark.reportedThrough } } : {}) },
    include: [{ model: Block, as: 'block', attributes: ['name', 'crop'], include: [{ model: Organization, as: 'farm', attributes: ['name'] }] }],
    order: [['createdAt', 'ASC']],
  });
  if (!revisions.length) return 0;
  const recipients = await User.findAll({
    attributes: ['email'], where: { organizationId: apiaryId, role: ['owner', 'manager'], disabledAt: null }, order: [['email', 'ASC']],
  });
  const lines = revisions.map((r) =>
    `- ${r.block!.farm!.name}, ${r.block!.name} (${labelOf(cropSet, r.block!.crop)}): bloom from ${day(r.bloomStart)}${r.fullBloom ? `, full bloom ${day(r.fullBloom)}` : ''}, petal fall ${day(r.petalFall)}` +
    (r.confidenceNote ? `\n  Note: ${r.confidenceNote}` : ''));
  const text = `Growers revised the bloom windows of blocks you hold or offered colonies for:\n\n${lines.join('\n')}\n\nOpen Pollenpact for the details: ${ctx.config.publicUrl}\n`;
  for (const { email } of recipients) {
    await enqueueEmail(ctx.jobs, { to: email, subject: `Bloom windows revised (${revisions.length})`, text });
  }
  const through = new Date(Math.max(...revisions.map((r) => r.createdAt.getTime())));
  await advanceDigestMark(ctx.sequelize, apiaryId, through);
  return revisions.length;
}

export async function startBloomDigestWorker(ctx: AppContext) {
  await ctx.jobs.addWorker<{ apiaryId: string }>(queueNames.bloomDigest, async ({ apiaryId }) => {
    await sendBloomDigest(ctx, apiaryId);
  });
}

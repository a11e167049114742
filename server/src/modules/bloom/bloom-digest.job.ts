// The e-mail digest of bloom-window revisions for one apiary business: every revision on
// a block it follows since its last digest, to its owners and managers.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { followingApiariesSql } from './bloom-audience.js';

interface RevisionRow {
  block_name: string; farm_name: string; crop: string; bloom_start: string; full_bloom: string | null; petal_fall: string;
  confidence_note: string | null; created_at: Date;
}

export async function sendBloomDigest(ctx: AppContext, apiaryId: string): Promise<number> {
  const { sequelize } = ctx;
  const [mark] = await sequelize.query<{ reported_through: Date }>('SELECT reported_through FROM bloom_digest_marks WHERE apiary_id = :apiaryId', {
    replacements: { apiaryId }, type: QueryTypes.SELECT,
  });
  const revisions = await sequelize.query<RevisionRow>(
    `SELECT b.name AS block_name, o.name AS farm_name, b.crop, to_char(w.bloom_start, 'YYYY-MM-DD') AS bloom_start,
       to_char(w.full_bloom, 'YYYY-MM-DD') AS full_bloom, to_char(w.petal_fall, 'YYYY-MM-DD') AS petal_fall, w.confidence_note, w.created_at
     FROM bloom_windows w JOIN blocks b ON b.id = w.block_id JOIN organizations o ON o.id = b.farm_id
     WHERE :apiaryId IN (${followingApiariesSql}) AND (:since::timestamptz IS NULL OR w.created_at > :since::timestamptz)
     ORDER BY w.created_at`,
    { replacements: { apiaryId, since: mark ? new Date(mark.reported_through).toISOString() : null }, type: QueryTypes.SELECT },
  );
  if (!revisions.length) return 0;
  const recipients = await sequelize.query<{ email: string }>(
    `SELECT email FROM users WHERE organization_id = :apiaryId AND role IN ('owner', 'manager') AND disabled_at IS NULL ORDER BY email`,
    { replacements: { apiaryId }, type: QueryTypes.SELECT },
  );
  const lines = revisions.map((r) =>
    `- ${r.farm_name}, ${r.block_name} (${r.crop}): bloom from ${r.bloom_start}${r.full_bloom ? `, full bloom ${r.full_bloom}` : ''}, petal fall ${r.petal_fall}` +
    (r.confidence_note ? `\n  Note: ${r.confidence_note}` : ''));
  const text = `Growers revised the bloom windows of blocks you hold or offered colonies for:\n\n${lines.join('\n')}\n\nOpen Pollenpact for the details: ${ctx.config.publicUrl}\n`;
  for (const { email } of recipients) {
    await enqueueEmail(ctx.jobs, { to: email, subject: `Bloom windows revised (${revisions.length})`, text });
  }
  const through = new Date(Math.max(...revisions.map((r) => new Date(r.created_at).getTime())));
  await sequelize.query(
    `INSERT INTO bloom_digest_marks (apiary_id, reported_through) VALUES (:apiaryId, :through)
     ON CONFLICT (apiary_id) DO UPDATE SET reported_through = GREATEST(bloom_digest_marks.reported_through, EXCLUDED.reported_through)`,
    { replacements: { apiaryId, through: through.toISOString() } },
  );
  return revisions.length;
}

export async function startBloomDigestWorker(ctx: AppContext) {
  await ctx.jobs.addWorker<{ apiaryId: string }>(queueNames.bloomDigest, async ({ apiaryId }) => {
    await sendBloomDigest(ctx, apiaryId);
  });
}

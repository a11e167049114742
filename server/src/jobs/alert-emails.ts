// E-mails for a raised conflict alert: one per member of the farm and of the affected
// apiary business who acts on sprays (viewers excepted), through the e-mail queue, so a
// message that fails while the SMTP server is down is retried until it goes out.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../context.js';
import { enqueueEmail } from './send-email.job.js';
import { conflictGradeLabels } from '../../../shared/domain/conflict-grading.js';
import type { AlertDto } from '../../../shared/schemas/alerts.js';

export async function enqueueAlertEmails(ctx: AppContext, alert: AlertDto): Promise<number> {
  const orgIds = [alert.farm.id, ...(alert.apiary ? [alert.apiary.id] : [])];
  const people = await ctx.sequelize.query<{ email: string }>(
    `SELECT email FROM users WHERE organization_id = ANY(CAST(:orgIds AS uuid[])) AND role <> 'viewer' AND disabled_at IS NULL ORDER BY email`,
    { replacements: { orgIds: `{${orgIds.join(',')}}` }, type: QueryTypes.SELECT },
  );
  const subject = `Spray alert: ${conflictGradeLabels[alert.grade]} — ${alert.spray.productName} on ${alert.spray.blockNames.join(', ')}`;
  const text = [
    `${alert.farm.name} plans ${alert.spray.productName}${alert.spray.epaRegNo ? ` (EPA Reg. No. ${alert.spray.epaRegNo})` : ''} on ${alert.spray.blockNames.join(', ')},`,
    `from ${alert.spray.startsAt} to ${alert.spray.endsAt} (UTC).`,
    alert.apiary ? `Colonies of ${alert.apiary.name} are affected.` : '',
    '',
    'Why:',
    ...alert.reasons.map((r) => `- ${r}`),
    '',
    ...alert.cautions,
    '',
    `See and answer the alert: ${ctx.config.publicUrl}/alerts/${alert.id}`,
  ].join('\n');
  for (const person of people) await enqueueEmail(ctx.jobs, { to: person.email, subject, text });
  return people.length;
}

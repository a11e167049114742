// The e-mail for a raised conflict alert: who gets it (every member of the farm and of the
// affected apiary business who acts on sprays, viewers and disabled accounts excepted) and
// what it says. alert-outbox.ts queues one message per person in the alert's transaction.
import { Op, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { conflictGradeSet } from '../../../../shared/labels/sprays.js';
import { zonedRange } from '../../../../shared/domain/zoned-time.js';
import type { AlertDto } from '../../../../shared/schemas/alerts.js';

export async function alertRecipients(ctx: AppContext, alert: AlertDto, transaction?: Transaction): Promise<string[]> {
  const orgIds = [alert.farm.id, ...(alert.apiary ? [alert.apiary.id] : [])];
  const people = await ctx.models.User.findAll({
    where: { organizationId: orgIds, role: { [Op.ne]: 'viewer' }, disabledAt: null },
    attributes: ['email'],
    order: [['email', 'ASC']],
    transaction,
  });
  return people.map((p) => p.email);
}

export function alertEmail(ctx: AppContext, alert: AlertDto): { subject: string; text: string } {
  const subject = `Spray alert: ${conflictGradeSet.labels[alert.grade]} — ${alert.spray.productName} on ${alert.spray.blockNames.join(', ')}`;
  const text = [
    `${alert.farm.name} plans ${alert.spray.productName}${alert.spray.epaRegNo ? ` (EPA Reg. No. ${alert.spray.epaRegNo})` : ''} on ${alert.spray.blockNames.join(', ')},`,
    `${zonedRange(alert.spray.startsAt, alert.spray.endsAt, alert.farm.timeZone)} (the farm's time, ${alert.farm.timeZone}).`,
    alert.apiary ? `Colonies of ${alert.apiary.name} are affected.` : '',
    '',
    'Why:',
    ...alert.reasons.map((r) => `- ${r}`),
    '',
    ...alert.cautions,
    '',
    `See and answer the alert: ${ctx.config.publicUrl}/alerts/${alert.id}`,
  ].join('\n');
  return { subject, text };
}

// Overdue reminders: a pg-boss schedule runs this every hour; each overdue invoice gets at
// most one reminder per its agreed interval (the log row and the invoice lock make a second
// run, or a second server, skip it).
import { Op } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { formatMoney } from '../../../../shared/domain/money.js';
import { selectIssuedInvoices } from './invoices.queries.js';
import { toInvoiceSummary, formatInvoiceNumber } from './invoice-summary.js';
import { billingContactOf } from './invoice-mail.js';

/** Sends the reminders due now; answers how many were sent. */
export async function sendOverdueReminders(ctx: AppContext): Promise<number> {
  const asOf = ctx.now();
  let sent = 0;
  const { Invoice, InvoiceReminder } = ctx.models;
  for (const row of await selectIssuedInvoices(ctx.sequelize)) {
    const summary = toInvoiceSummary(row, asOf);
    if (summary.status !== 'overdue') continue;
    const to = await billingContactOf(ctx, row.farm_id);
    if (!to) continue;
    const didSend = await ctx.sequelize.transaction(async (transaction) => {
      const locked = await Invoice.findOne({ where: { id: row.id }, attributes: ['id'], lock: transaction.LOCK.UPDATE, skipLocked: true, transaction });
      if (!locked) return false;
      const since = new Date(asOf.getTime() - row.reminder_interval_days * 86_400_000);
      const recent = await InvoiceReminder.count({ where: { invoiceId: row.id, sentAt: { [Op.gt]: since } }, transaction });
      if (recent > 0) return false;
      await InvoiceReminder.create({ invoiceId: row.id, sentAt: asOf, sentTo: to, overdueCents: summary.outstandingCents }, { transaction });
      const money = (c: number) => formatMoney(c, row.currency);
      const number = formatInvoiceNumber(row.number);
      await enqueueEmail(ctx.jobs, {
        to,
        subject: `Reminder: invoice ${number} from ${row.apiary_name} is overdue`,
        text: [
          `Invoice ${number} from ${row.apiary_name} for pollination in ${row.season} has ${money(summary.outstandingCents)} outstanding past its due date.`,
          summary.accruedInterestCents > 0
            ? `Late interest as agreed (${row.late_interest_bp_per_month / 100}% per started month): ${money(summary.accruedInterestCents)} to date.`
            : '',
          'Sign in to Pollenpact to pay online, or contact the beekeeper if you have already paid.',
        ].filter(Boolean).join('\n\n'),
      }, { transaction: { sequelize: ctx.sequelize, transaction } });
      return true;
    });
    if (didSend) sent += 1;
  }
  return sent;
}

export async function startOverdueReminders(ctx: AppContext) {
  await ctx.jobs.addWorker(queueNames.invoiceReminders, async () => {
    await sendOverdueReminders(ctx);
  });
  await ctx.jobs.schedule(queueNames.invoiceReminders, '0 * * * *');
}

// Overdue reminders: a pg-boss schedule runs this every hour; each overdue invoice gets at
// most one reminder per its agreed interval (the log row and the invoice lock make a second
// run, or a second server, skip it).
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { formatMoney } from '../../../../shared/domain/money.js';
import { selectIssuedInvoices, toInvoiceSummary, formatInvoiceNumber } from './invoice-queries.js';
import { billingContactOf } from './invoice-mail.js';

/** Sends the reminders due now; answers how many were sent. */
export async function sendOverdueReminders(ctx: AppContext): Promise<number> {
  const asOf = ctx.now();
  let sent = 0;
  for (const row of await selectIssuedInvoices(ctx)) {
    const summary = toInvoiceSummary(row, asOf);
    if (summary.status !== 'overdue') continue;
    const to = await billingContactOf(ctx, row.farm_id);
    if (!to) continue;
    const didSend = await ctx.sequelize.transaction(async (transaction) => {
      const locked = await ctx.sequelize.query('SELECT id FROM invoices WHERE id = :id FOR UPDATE SKIP LOCKED', { replacements: { id: row.id }, type: QueryTypes.SELECT, transaction });
      if (locked.length === 0) return false;
      const [recent] = await ctx.sequelize.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM invoice_reminders WHERE invoice_id = :id AND sent_at > :asOf::timestamptz - make_interval(days => :days)`,
        { replacements: { id: row.id, asOf: asOf.toISOString(), days: row.reminder_interval_days }, type: QueryTypes.SELECT, transaction },
      );
      if (recent.n > 0) return false;
      await ctx.sequelize.query('INSERT INTO invoice_reminders (invoice_id, sent_at, sent_to, overdue_cents) VALUES (:id, :asOf, :to, :cents)', {
        replacements: { id: row.id, asOf: asOf.toISOString(), to, cents: summary.outstandingCents }, transaction,
      });
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
      });
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

// Overpayments and one open checkout per invoice: a payment that arrives when less (or
// nothing) is owed keeps how much of it went beyond the balance, so both sides see it and
// the beekeeper can refund it; the invoice remembers its one open checkout session, which
// a new checkout expires at the payments service before opening another.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    ALTER TABLE payments ADD COLUMN overpaid_cents integer NOT NULL DEFAULT 0
      CHECK (overpaid_cents >= 0 AND overpaid_cents <= amount_cents);
    ALTER TABLE invoices ADD COLUMN open_checkout_session_id text;
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('ALTER TABLE invoices DROP COLUMN open_checkout_session_id; ALTER TABLE payments DROP COLUMN overpaid_cents');
}

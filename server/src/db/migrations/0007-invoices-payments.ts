// Invoices and payments: invoices drafted from an agreement with their lines, credit
// notes, per-apiary number counters (gapless: a counter row locked FOR UPDATE when a
// number is taken), payments (online and manual), refunds, the payment service's webhook
// events already processed (idempotency) and the overdue reminders sent.
import type { MigrationContext } from '../migrator.js';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(`
    -- How often an overdue invoice may be reminded, as agreed (days).
    ALTER TABLE agreements ADD COLUMN reminder_interval_days integer NOT NULL DEFAULT 7 CHECK (reminder_interval_days BETWEEN 1 AND 90);

    CREATE TABLE invoice_number_counters (
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE CASCADE,
      series text NOT NULL CHECK (series IN ('invoice', 'credit-note')),
      last_number integer NOT NULL DEFAULT 0 CHECK (last_number >= 0),
      PRIMARY KEY (apiary_id, series)
    );

    CREATE TABLE invoices (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      agreement_id uuid NOT NULL REFERENCES agreements(id) ON DELETE RESTRICT,
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE RESTRICT,
      farm_id uuid NOT NULL REFERENCES organizations(id) ON DELETE RESTRICT,
      lifecycle text NOT NULL DEFAULT 'draft' CHECK (lifecycle IN ('draft', 'issued', 'void')),
      number integer CHECK (number > 0),
      currency char(3) NOT NULL,
      time_zone text NOT NULL,
      extra_moves integer NOT NULL DEFAULT 0 CHECK (extra_moves >= 0),
      subtotal_cents integer NOT NULL CHECK (subtotal_cents >= 0),
      tax_rate_bp integer NOT NULL CHECK (tax_rate_bp BETWEEN 0 AND 10000),
      tax_cents integer NOT NULL CHECK (tax_cents >= 0),
      total_cents integer NOT NULL CHECK (total_cents >= 0),
      deposit_cents integer NOT NULL CHECK (deposit_cents >= 0),
      deposit_due_on date,
      balance_due_on date,
      late_interest_bp_per_month integer NOT NULL,
      reminder_interval_days integer NOT NULL,
      notes text,
      issued_at timestamptz,
      issued_by uuid REFERENCES users(id) ON DELETE SET NULL,
      voided_at timestamptz,
      void_reason text,
      created_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (apiary_id, number),
      CHECK ((lifecycle = 'draft') = (number IS NULL))
    );
    -- One live invoice per agreement: a void one may be replaced.
    CREATE UNIQUE INDEX invoices_live_agreement_idx ON invoices (agreement_id) WHERE lifecycle <> 'void';
    CREATE INDEX invoices_apiary_idx ON invoices (apiary_id, lifecycle);
    CREATE INDEX invoices_farm_idx ON invoices (farm_id, lifecycle);

    CREATE TABLE invoice_lines (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
      position integer NOT NULL,
      kind text NOT NULL CHECK (kind IN ('colonies-full-rate', 'colonies-below-minimum', 'extra-moves')),
      placement_id uuid REFERENCES placements(id) ON DELETE SET NULL,
      description text NOT NULL,
      quantity integer NOT NULL CHECK (quantity >= 0),
      unit_cents integer NOT NULL CHECK (unit_cents >= 0),
      amount_cents integer NOT NULL CHECK (amount_cents >= 0),
      UNIQUE (invoice_id, position)
    );

    CREATE TABLE credit_notes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE RESTRICT,
      apiary_id uuid NOT NULL REFERENCES organizations(id) ON DELETE RESTRICT,
      number integer NOT NULL CHECK (number > 0),
      amount_cents integer NOT NULL CHECK (amount_cents > 0),
      reason text NOT NULL CHECK (length(reason) BETWEEN 1 AND 500),
      created_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (apiary_id, number)
    );
    CREATE INDEX credit_notes_invoice_idx ON credit_notes (invoice_id);

    CREATE TABLE payments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE RESTRICT,
      method text NOT NULL CHECK (method IN ('online', 'cheque', 'bank-transfer')),
      -- Online: pending until a verified webhook says succeeded or failed; succeeded is final.
      state text NOT NULL CHECK (state IN ('pending', 'succeeded', 'failed')),
      amount_cents integer NOT NULL CHECK (amount_cents > 0),
      currency char(3) NOT NULL,
      provider_payment_id text UNIQUE,
      failure_message text,
      reference text,
      received_at timestamptz,
      recorded_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX payments_invoice_idx ON payments (invoice_id);

    -- Refunds are kept by the payment service's ids; they count once their payment has succeeded,
    -- so a refund event that arrives before its payment's event is not lost.
    CREATE TABLE refunds (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE RESTRICT,
      provider_refund_id text NOT NULL UNIQUE,
      provider_payment_id text NOT NULL,
      state text NOT NULL CHECK (state IN ('pending', 'succeeded', 'failed')),
      amount_cents integer NOT NULL CHECK (amount_cents > 0),
      reason text,
      requested_by uuid REFERENCES users(id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX refunds_invoice_idx ON refunds (invoice_id);

    CREATE TABLE processed_webhook_events (
      event_id text PRIMARY KEY,
      type text NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE invoice_reminders (
      id bigserial PRIMARY KEY,
      invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
      sent_at timestamptz NOT NULL,
      sent_to text NOT NULL,
      overdue_cents integer NOT NULL
    );
    CREATE INDEX invoice_reminders_invoice_idx ON invoice_reminders (invoice_id, sent_at DESC);
  `);
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query(`DROP TABLE invoice_reminders, processed_webhook_events, refunds, payments, credit_notes, invoice_lines, invoices,
    invoice_number_counters; ALTER TABLE agreements DROP COLUMN reminder_interval_days`);
}

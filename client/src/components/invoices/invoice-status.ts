// Tag colours for the invoice states (their words: shared/labels/invoices.ts).
import type { InvoiceStatus } from '@shared/domain/invoice-pricing';

export const invoiceStatusSeverity: Record<InvoiceStatus, 'secondary' | 'info' | 'warn' | 'success' | 'danger' | 'contrast'> = {
  draft: 'secondary', issued: 'info', 'partly-paid': 'warn', paid: 'success', overdue: 'danger', void: 'contrast',
};

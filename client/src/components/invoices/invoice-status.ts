// Words and tag colours for the invoice states.
import type { InvoiceStatus } from '@shared/domain/invoice-pricing';

export const invoiceStatusLabels: Record<InvoiceStatus, string> = {
  draft: 'Draft', issued: 'Issued', 'partly-paid': 'Partly paid', paid: 'Paid', overdue: 'Overdue', void: 'Void',
};

export const invoiceStatusSeverity: Record<InvoiceStatus, 'secondary' | 'info' | 'warn' | 'success' | 'danger' | 'contrast'> = {
  draft: 'secondary', issued: 'info', 'partly-paid': 'warn', paid: 'success', overdue: 'danger', void: 'contrast',
};

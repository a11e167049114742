// Invoices, their lines, and the payments and refunds against them.
import { invoiceStatuses, type InvoiceStatus, type PricedLineKind } from '../domain/invoice-pricing.js';
import { labelSet } from './label-set.js';

export const invoiceStatusSet = labelSet<InvoiceStatus>('invoice states', invoiceStatuses, {
  draft: 'Draft',
  issued: 'Issued',
  'partly-paid': 'Partly paid',
  paid: 'Paid',
  overdue: 'Overdue',
  void: 'Void',
});

export const pricedLineKinds = ['colonies-full-rate', 'colonies-below-minimum', 'extra-moves'] as const satisfies readonly PricedLineKind[];

export const pricedLineSet = labelSet<PricedLineKind>('invoice lines', pricedLineKinds, {
  'colonies-full-rate': 'Colonies at the full rate',
  'colonies-below-minimum': 'Colonies below the minimum strength',
  'extra-moves': 'Extra moves',
});

/** Online payments and refunds share these states. */
export const paymentStates = ['pending', 'succeeded', 'failed'] as const;
export type PaymentState = (typeof paymentStates)[number];

export const paymentStateSet = labelSet<PaymentState>('payment and refund states', paymentStates, {
  pending: 'Waiting for the bank',
  succeeded: 'Received',
  failed: 'Failed',
});

/** How a payment came in: online through the payment service, or recorded by the beekeeper. */
export const paymentMethods = ['online', 'cheque', 'bank-transfer'] as const;
export type PaymentMethod = (typeof paymentMethods)[number];

export const paymentMethodSet = labelSet<PaymentMethod>('payment methods', paymentMethods, {
  online: 'Card online',
  cheque: 'Check',
  'bank-transfer': 'Bank transfer',
});

// Invoice and payment calls: lists and reports, draft, issue, void, credit notes, manual
// payments, refunds, the online checkout, and the live "invoice changed" event.
import { http } from './http';
import { connectSocket } from './socket';
import type {
  BillableAgreementDto, CheckoutDto, CreditNoteInput, DraftInvoiceInput, InvoiceDto, InvoiceSummaryDto, ManualPaymentInput, PayablesDto,
  ReceivablesDto, RefundInput, UpdateDraftInput,
} from '@shared/schemas/invoices';
import type { InvoiceStatus } from '@shared/domain/invoice-pricing';
import type { ServerToClientEvents } from '@shared/events';

type Season = { season: number };

export const invoicesApi = {
  list: (status?: InvoiceStatus) => http.get<{ invoices: InvoiceSummaryDto[] }>('/invoices', { query: { status } }),
  get: (id: string) => http.get<{ invoice: InvoiceDto }>(`/invoices/${id}`),
  billableAgreements: () => http.get<{ agreements: BillableAgreementDto[] }>('/invoices/billable-agreements'),
  receivables: (season?: number) => http.get<ReceivablesDto & Season>('/invoices/receivables', { query: { season } }),
  payables: (season?: number) => http.get<PayablesDto & Season>('/invoices/payables', { query: { season } }),
  draft: (body: DraftInvoiceInput) => http.post<{ invoice: InvoiceDto }>('/invoices', body),
  updateDraft: (id: string, body: UpdateDraftInput) => http.patch<{ invoice: InvoiceDto }>(`/invoices/${id}`, body),
  discardDraft: (id: string) => http.delete<void>(`/invoices/${id}`),
  issue: (id: string) => http.post<{ invoice: InvoiceDto }>(`/invoices/${id}/issue`, {}),
  void: (id: string, reason: string) => http.post<{ invoice: InvoiceDto }>(`/invoices/${id}/void`, { reason }),
  addCreditNote: (id: string, body: CreditNoteInput) => http.post<{ invoice: InvoiceDto }>(`/invoices/${id}/credit-notes`, body),
};

export const paymentsApi = {
  checkout: (invoiceId: string) => http.post<CheckoutDto>('/payments/checkout', { invoiceId }),
  recordManual: (body: ManualPaymentInput) => http.post<{ invoice: InvoiceDto }>('/payments', body),
  refund: (paymentId: string, body: RefundInput) => http.post<{ refundId: string }>(`/payments/${paymentId}/refunds`, body),
};

export const invoiceFileUrls = {
  invoicesCsv: '/api/invoices/export.csv',
  paymentsCsv: '/api/payments/export.csv',
  pdf: (id: string) => `/api/invoices/${id}/pdf`,
};

/** Calls the handler whenever an invoice of the user's business changes; returns the unsubscribe. */
export function onInvoiceUpdated(handler: ServerToClientEvents['invoice:updated']): () => void {
  const socket = connectSocket();
  socket.on('invoice:updated', handler);
  return () => socket.off('invoice:updated', handler);
}

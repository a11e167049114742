// Invoice calls (server module invoices): lists and reports, draft, issue, void, credit notes, and the file addresses.
import { http } from './http';
import type {
  BillableAgreementDto, CreditNoteInput, DraftInvoiceInput, InvoiceDto, InvoiceSummaryDto, PayablesDto,
  ReceivablesDto, UpdateDraftInput,
} from '@shared/schemas/invoices';
import type { InvoiceStatus } from '@shared/domain/invoice-pricing';

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

export const invoiceFileUrls = {
  invoicesCsv: '/api/invoices/export.csv',
  paymentsCsv: '/api/payments/export.csv',
  pdf: (id: string) => `/api/invoices/${id}/pdf`,
};

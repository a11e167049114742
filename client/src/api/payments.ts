// Payment calls (server module payments): the online checkout, payments recorded by hand, refunds.
import { http } from './http';
import type { CheckoutDto, InvoiceDto, ManualPaymentInput, RefundInput } from '@shared/schemas/invoices';

export const paymentsApi = {
  checkout: (invoiceId: string) => http.post<CheckoutDto>('/payments/checkout', { invoiceId }),
  recordManual: (body: ManualPaymentInput) => http.post<{ invoice: InvoiceDto }>('/payments', body),
  refund: (paymentId: string, body: RefundInput) => http.post<{ refundId: string }>(`/payments/${paymentId}/refunds`, body),
};

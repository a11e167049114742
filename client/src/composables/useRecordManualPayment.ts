// Recording a check or bank transfer received for an invoice (useSubmit's saving, error,
// fieldErrors and submit); the answer is the invoice with the payment counted.
import { paymentsApi } from '@/api/payments';
import { useSubmit } from './useSubmit';
import type { ManualPaymentInput } from '@shared/schemas/invoices';

export function useRecordManualPayment() {
  return useSubmit(async (body: ManualPaymentInput) => (await paymentsApi.recordManual(body)).invoice);
}

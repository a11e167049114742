// Correcting an issued invoice with a credit note (useSubmit's saving, error, fieldErrors
// and submit); the answer is the invoice with the new credit note on it.
import { invoicesApi } from '@/api/invoices';
import { useSubmit } from './useSubmit';
import type { CreditNoteInput } from '@shared/schemas/invoices';

export function useAddCreditNote(invoiceId: () => string) {
  return useSubmit(async (body: CreditNoteInput) => (await invoicesApi.addCreditNote(invoiceId(), body)).invoice);
}

// Saving a draft invoice's extra moves and note (useSubmit's saving, error, fieldErrors and
// submit); the server re-prices it from the current placements and answers the draft.
import { invoicesApi } from '@/api/invoices';
import { useSubmit } from './useSubmit';
import type { UpdateDraftInput } from '@shared/schemas/invoices';

export function useUpdateInvoiceDraft(invoiceId: () => string) {
  return useSubmit(async (body: UpdateDraftInput) => (await invoicesApi.updateDraft(invoiceId(), body)).invoice);
}

// Drafting an invoice from a signed agreement (useSubmit's saving, error, fieldErrors and
// submit); `drafting` names the agreement whose draft is being made, so a list of them can
// show which one is busy. The answer is the draft invoice.
import { computed, ref } from 'vue';
import { invoicesApi } from '@/api/invoices';
import { useSubmit } from './useSubmit';

export function useDraftInvoice() {
  const agreementId = ref<string | null>(null);
  const draft = useSubmit(async (id: string) => {
    agreementId.value = id;
    return (await invoicesApi.draft({ agreementId: id, extraMoves: 0 })).invoice;
  });
  const drafting = computed(() => (draft.saving.value ? agreementId.value : null));
  return { ...draft, drafting };
}

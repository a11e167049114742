// Saving a new hive request (useSubmit's saving, error, fieldErrors and submit): as a draft,
// or saved and opened for commitments at once. The answer is the request as saved.
// Opening can be refused once the draft is saved (no drop site yet, an answer deadline
// already past): the form keeps that draft (`savedDraft`), and saving again changes it
// rather than saving a second request.
import { ref } from 'vue';
import { requestsApi } from '@/api/requests';
import { useSubmit } from './useSubmit';
import type { RequestBody, RequestDetailDto } from '@shared/schemas/requests';

export function useSaveHiveRequest() {
  const savedDraft = ref<RequestDetailDto | null>(null);
  const saving = useSubmit(async (body: RequestBody, open: boolean) => {
    const { request } = savedDraft.value ? await requestsApi.update(savedDraft.value.id, body) : await requestsApi.create(body);
    savedDraft.value = request;
    return open ? (await requestsApi.publish(request.id)).request : request;
  });
  return { ...saving, savedDraft };
}

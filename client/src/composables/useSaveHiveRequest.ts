// Saving a new hive request (useSubmit's saving, error, fieldErrors and submit): as a draft,
// or saved and opened for commitments at once. The answer is the request as saved.
import { requestsApi } from '@/api/requests';
import { useSubmit } from './useSubmit';
import type { RequestBody } from '@shared/schemas/requests';

export function useSaveHiveRequest() {
  return useSubmit(async (body: RequestBody, open: boolean) => {
    const { request } = await requestsApi.create(body);
    return open ? (await requestsApi.publish(request.id)).request : request;
  });
}

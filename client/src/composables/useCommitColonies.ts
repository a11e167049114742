// A beekeeper's commitment of colonies to a hive request (useSubmit's saving, error,
// fieldErrors and submit); the answer is the commitment, accepted or waiting as an offer.
import { commitmentsApi } from '@/api/commitments';
import { useSubmit } from './useSubmit';
import type { CommitmentBody } from '@shared/schemas/requests';

export function useCommitColonies(requestId: () => string) {
  return useSubmit(async (body: CommitmentBody) => (await commitmentsApi.offer(requestId(), body)).commitment);
}

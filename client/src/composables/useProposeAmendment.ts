// Proposing a change to a confirmed agreement (useSubmit's saving, error, fieldErrors and
// submit); the answer is the agreement with the proposal on it.
import { agreementsApi } from '@/api/agreements';
import { useSubmit } from './useSubmit';
import type { AmendmentBody } from '@shared/schemas/agreements';

export function useProposeAmendment(agreementId: () => string) {
  return useSubmit(async (body: AmendmentBody) => (await agreementsApi.propose(agreementId(), body)).agreement);
}

// Recording a pheromone trap check on a block (useSubmit's saving, error, fieldErrors and
// submit); the answer is the trap count as stored.
import { pestsApi } from '@/api/pests';
import { useSubmit } from './useSubmit';
import type { TrapCountInput } from '@shared/schemas/pests';

export function useRecordTrapCount() {
  return useSubmit(async (body: TrapCountInput) => (await pestsApi.recordTrapCount(body)).trapCount);
}

// A farm's own stage threshold for a crop (and variety), replacing the published one for its
// blocks (useSubmit's saving, error, fieldErrors and submit; a refusal is toasted "Not added").
import { bloomApi } from '@/api/bloom';
import { useSubmit } from './useSubmit';
import type { StageThresholdBody } from '@shared/schemas/weather';

export function useAddStageThreshold() {
  return useSubmit(async (body: StageThresholdBody) => (await bloomApi.addThreshold(body)).threshold, { failed: 'Not added' });
}

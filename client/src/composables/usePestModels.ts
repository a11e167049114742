// The pest models the server knows (thresholds, biofix rule, source), loaded at once
// (useAsync's data, loading, error and run).
import { pestsApi } from '@/api/pests';
import { useAsync } from './useAsync';

export function usePestModels() {
  return useAsync(async () => (await pestsApi.models()).models);
}

// The farm's blocks, for a picker or a list (useAsync's data, loading, error and run),
// loaded at once.
import { blocksApi } from '@/api/blocks';
import { useAsync } from './useAsync';

export function useBlockList() {
  return useAsync(async () => (await blocksApi.list()).blocks);
}

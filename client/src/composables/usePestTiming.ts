// A pest model's timing for one block and season (null: this season), with that season's
// trap checks; loaded again whenever the block or the season changes (useAsync's data,
// loading, error and run, which takes the block id).
import { watch } from 'vue';
import { pestsApi } from '@/api/pests';
import { useAsync } from './useAsync';

export function usePestTiming(pestModelId: string, blockId: () => string | null, season: () => number | null) {
  const timing = useAsync(async (id: string) => {
    const [t, c] = await Promise.all([pestsApi.timing(id, pestModelId, season() ?? undefined), pestsApi.trapCounts(id, pestModelId)]);
    return { timing: t.timing, counts: c.trapCounts.filter((x) => x.checkedOn.startsWith(String(t.timing.season))) };
  }, { immediate: false });
  watch([blockId, season], ([id]) => { if (id) void timing.run(id); });
  return timing;
}

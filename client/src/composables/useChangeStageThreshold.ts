// Changing one stage threshold row in place (its degree days and source): useAction's busy
// and toasts, a refusal titled "Not changed", then the thresholds reloaded.
import { bloomApi } from '@/api/bloom';
import { useAction } from './useAction';

export interface StageThresholdChange { ddLowF: number; ddHighF: number; source: string }

export function useChangeStageThreshold(reload: () => unknown) {
  const { busy, act } = useAction(reload, { failed: 'Not changed' });
  const change = (thresholdId: string, values: StageThresholdChange) => act(() => bloomApi.updateThreshold(thresholdId, values), 'Threshold changed');
  return { busy, change };
}

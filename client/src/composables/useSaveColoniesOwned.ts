// Saving how many colonies the beekeeping business owns, for its season overview
// (useSubmit's saving, error, fieldErrors and submit); the answer is the stored total.
import { dashboardApi } from '@/api/dashboard';
import { useSubmit } from './useSubmit';

export function useSaveColoniesOwned() {
  return useSubmit(async (coloniesOwned: number | null) => (await dashboardApi.setColoniesOwned(coloniesOwned)).coloniesOwned, { done: 'Colony total saved' });
}

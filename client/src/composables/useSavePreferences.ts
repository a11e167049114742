// Saving the user's display preferences (units and time zone) through the session store, so
// every page shows the new units at once (useSubmit's saving, error, fieldErrors and submit).
import { useSessionStore } from '@/stores/session';
import { useSubmit } from './useSubmit';
import type { PreferencesBody } from '@shared/schemas/auth';

export function useSavePreferences() {
  const session = useSessionStore();
  return useSubmit((body: PreferencesBody) => session.updatePreferences(body), { done: 'Preferences saved' });
}

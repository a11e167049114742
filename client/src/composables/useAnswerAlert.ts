// Answering a conflict alert (useSubmit's saving, error, fieldErrors and submit); the alerts
// store keeps the answered alert, so every list showing it follows.
import { useAlertsStore } from '@/stores/alerts';
import { useSubmit } from './useSubmit';
import type { AlertAnswer } from '@shared/schemas/alerts';

export function useAnswerAlert(alertId: () => string) {
  const alerts = useAlertsStore();
  return useSubmit((body: AlertAnswer) => alerts.answer(alertId(), body));
}

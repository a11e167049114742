// The signed-in organization's conflict alerts: loaded once, kept current from the socket,
// and, after a reconnect, topped up with everything changed since the last revision seen.
// Alerts are delivered at least once: a revision already held is dropped (by id and revision).
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { alertsApi, onAlertEvents } from '@/api/alerts';
import type { AlertDto } from '@shared/schemas/alerts';

export const useAlertsStore = defineStore('alerts', () => {
  const byId = ref(new Map<string, AlertDto>());
  const latestRevision = ref(0);
  const loaded = ref(false);
  let stop: (() => void) | null = null;
  const arrivedListeners = new Set<(alert: AlertDto) => void>();

  const alerts = computed(() => [...byId.value.values()].sort((a, b) => b.revision - a.revision));
  const unseen = computed(() => alerts.value.filter((a) => a.state !== 'resolved' && !a.seenByMe).length);

  /** Keeps the newest revision of each alert; false when it was already held (a replayed delivery). */
  function upsert(alert: AlertDto): boolean {
    const current = byId.value.get(alert.id);
    if (current && current.revision >= alert.revision) return false;
    const next = new Map(byId.value);
    next.set(alert.id, alert);
    byId.value = next;
    latestRevision.value = Math.max(latestRevision.value, alert.revision);
    return true;
  }

  async function catchUp() {
    const { alerts: changed, latestRevision: latest } = await alertsApi.list({ since: latestRevision.value });
    for (const alert of changed) upsert(alert);
    latestRevision.value = Math.max(latestRevision.value, latest);
  }

  async function start() {
    if (stop) return;
    stop = onAlertEvents({
      raised: (alert) => {
        if (upsert(alert)) for (const listener of arrivedListeners) listener(alert);
      },
      updated: upsert,
      reconnected: () => void catchUp(),
    });
    const { alerts: all, latestRevision: latest } = await alertsApi.list();
    for (const alert of all) upsert(alert);
    latestRevision.value = Math.max(latestRevision.value, latest);
    loaded.value = true;
  }

  function reset() {
    stop?.();
    stop = null;
    byId.value = new Map();
    latestRevision.value = 0;
    loaded.value = false;
  }

  /** Called for each newly raised alert (the bell shows a toast). */
  function onArrived(listener: (alert: AlertDto) => void) {
    arrivedListeners.add(listener);
    return () => arrivedListeners.delete(listener);
  }

  return {
    alerts, unseen, latestRevision, loaded, start, reset, catchUp, upsert, onArrived,
    async markSeen(id: string) { upsert((await alertsApi.seen(id)).alert); },
    async answer(id: string, body: Parameters<typeof alertsApi.answer>[1]) { upsert((await alertsApi.answer(id, body)).alert); },
  };
});

// Keeps an overview current: when the server announces a change to bloom, requests,
// commitments, agreements, placements, alerts or invoices, the page reloads its figures
// (once per burst of events). Listeners go when the page does.
import { onBeforeUnmount, onMounted } from 'vue';
import { currentSocket } from '@/api/socket';
import type { ServerToClientEvents } from '@shared/events';

const seasonEvents = [
  'bloom:revised', 'request:updated', 'commitment:updated', 'agreement:updated', 'placement:updated', 'alert:raised', 'alert:updated', 'invoice:updated',
] as const satisfies ReadonlyArray<keyof ServerToClientEvents>;

export function useSeasonUpdates(reload: () => unknown, delayMs = 400) {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const schedule = () => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void reload();
    }, delayMs);
  };
  onMounted(() => {
    const socket = currentSocket();
    for (const event of seasonEvents) socket?.on(event, schedule);
  });
  onBeforeUnmount(() => {
    const socket = currentSocket();
    for (const event of seasonEvents) socket?.off(event, schedule);
    if (timer) clearTimeout(timer);
  });
}

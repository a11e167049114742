// Field work at app start: the outbox sends for whoever is signed in (and waits while
// nobody is), the crew's reads for the week are kept for offline use once the service
// worker controls the page, and a sign-out forgets them on this phone. The outbox (and
// Dexie with it) loads only once someone is signed in, off the first page's critical path.
import { watch } from 'vue';
import { useSessionStore } from '@/stores/session';
import { forgetFieldReads, warmFieldReads } from './field-cache';

export function startFieldWork(): void {
  const session = useSessionStore();
  let outbox: Promise<typeof import('./outbox')> | null = null;
  const loadOutbox = () => (outbox ??= import('./outbox').then((module) => {
    module.startFieldOutbox(() => session.user?.id ?? null);
    return module;
  }));
  const warm = () => { if (session.side === 'apiary') void warmFieldReads().catch(() => { /* offline or signed out: the last kept answers stay */ }); };
  watch(
    () => session.user?.id ?? null,
    (id, previous) => {
      if (previous && id !== previous) void forgetFieldReads();
      if (id) { void loadOutbox().then((module) => module.sendWaiting()); warm(); }
    },
  );
  navigator.serviceWorker?.addEventListener('controllerchange', warm);
}

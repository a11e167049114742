// Loaded into the service worker (importScripts). When the browser's Background Sync
// says the connection is back, the open app pages are asked to send their waiting field
// records; the pages hold the session, the CSRF token and the outbox logic, so sending
// stays in one place. Browsers without Background Sync send on `online` and app start.
self.addEventListener('sync', (event) => {
  if (event.tag !== 'field-outbox') return;
  event.waitUntil(
    self.clients.matchAll({ type: 'window', includeUncontrolled: true }).then((pages) => {
      for (const page of pages) page.postMessage({ type: 'field-outbox:send' });
    }),
  );
});

// Loaded into the service worker (importScripts; plain JavaScript, no bundler). Background
// Sync, where the browser has it: the page registers the tag `field-outbox` when it stores
// a field record, and the browser fires it once there is a connection, even with no page
// open. A page in front is asked to send its outbox itself (client/src/offline/outbox.ts).
// Otherwise (no page open, or only pages in the background, which the phone may have
// frozen) the worker sends the waiting records as that outbox does, so the page shows the
// right state when it is opened:
// - read from IndexedDB `pollenpact-field` (Dexie's database; fields in field-db.ts), the
//   signed-in crew member's steps in the order recorded, then the photos;
// - check the session (GET /api/auth/me) and take a CSRF token (GET /api/auth/csrf), as the
//   page's api layer does; a 401 leaves every record waiting (the page asks to sign in again);
// - send each to the page's route with its Idempotency-Key and the same body; mark it sent,
//   or refused with the server's message (and what the server records), or waiting again
//   when there is no connection or a server error (the sync is then failed, so the browser
//   tries again later).
// A record another sender marked sending moments ago is left to it; should both still send
// it, the Idempotency-Key makes the server keep it once.
(() => {
  const outboxTag = 'field-outbox';
  const sendingLeaseMs = 60_000;

  self.addEventListener('sync', (event) => {
    if (event.tag !== outboxTag) return;
    event.waitUntil(syncFieldOutbox());
  });

  async function syncFieldOutbox() {
    const pages = await self.clients.matchAll({ type: 'window', includeUncontrolled: true });
    if (pages.some((page) => page.visibilityState === 'visible')) {
      for (const page of pages) page.postMessage({ type: 'field-outbox:send' });
      return;
    }
    const db = await openOutbox();
    if (!db) return;
    try {
      await sendOutbox(db);
    } finally {
      db.close();
      // Pages follow the outbox through Dexie, which does not see these writes: tell them to read it again.
      for (const page of await self.clients.matchAll({ type: 'window', includeUncontrolled: true })) page.postMessage({ type: 'field-outbox:changed' });
    }
  }

  /** Why a sync has to be tried again later by the browser. */
  class TryLater extends Error {}

  async function sendOutbox(db) {
    const me = await fetch('/api/auth/me', { credentials: 'same-origin', cache: 'no-store', headers: { Accept: 'application/json' } });
    if (me.status === 401) return; // signed out meanwhile: the records wait for the next sign-in
    if (!me.ok) throw new TryLater(`session check answered ${me.status}`);
    const userId = (await me.json()).user?.id;
    if (!userId) return;
    let csrfToken = await fetchCsrfToken();

    for (;;) {
      const record = await takeNext(db, userId);
      if (!record) return;
      if (record === 'taken') throw new TryLater('another sender has the next record');
      let answer;
      try {
        answer = await post(record, csrfToken);
        if (answer.status === 403 && answer.error?.code === 'csrf_invalid') {
          csrfToken = await fetchCsrfToken();
          answer = await post(record, csrfToken);
        }
      } catch (err) {
        await update(db, record.seq, { state: 'waiting' }); // no connection
        throw err;
      }
      if (answer.ok) {
        const sent = { state: 'sent', sentAt: new Date().toISOString(), error: null };
        await update(db, record.seq, sent, record.kind === 'photo' ? ['photo'] : []);
        continue;
      }
      if (answer.status === 401) {
        await update(db, record.seq, { state: 'waiting' });
        return;
      }
      if (answer.status >= 400 && answer.status < 500 && ![408, 425, 429].includes(answer.status)) {
        await update(db, record.seq, {
          state: 'rejected',
          error: answer.error?.message || 'The request failed.',
          recorded: answer.error?.recorded?.placement ?? null,
        });
        continue;
      }
      await update(db, record.seq, { state: 'waiting' });
      throw new TryLater(`the server answered ${answer.status}`);
    }
  }

  async function fetchCsrfToken() {
    const res = await fetch('/api/auth/csrf', { credentials: 'same-origin', cache: 'no-store', headers: { Accept: 'application/json' } });
    if (!res.ok) throw new TryLater(`CSRF token answered ${res.status}`);
    return (await res.json()).csrfToken;
  }

  const stepPaths = { delivery: 'delivery', 'strength-check': 'strength-checks', pickup: 'pickup' };
  const stepBodies = { delivery: 'delivery', 'strength-check': 'strengthCheck', pickup: 'pickup' };

  /** One record to its route, as client/src/api/field-records.ts sends it; the answer's status and error body. */
  async function post(record, csrfToken) {
    const headers = { Accept: 'application/json', 'X-CSRF-Token': csrfToken, 'Idempotency-Key': record.key };
    let path;
    let body;
    if (record.kind === 'photo') {
      const step = record.photoStep ?? 'delivery';
      const photo = record.photo;
      body = new FormData();
      body.append('step', step);
      body.append('recordedAt', record.recordedAt);
      body.append('photo', photo, `${step}.${photo.type === 'image/png' ? 'png' : photo.type === 'image/webp' ? 'webp' : 'jpg'}`);
      path = 'photos';
    } else {
      headers['Content-Type'] = 'application/json';
      body = JSON.stringify(record[stepBodies[record.kind]]);
      path = stepPaths[record.kind];
    }
    const res = await fetch(`/api/placements/${record.placementId}/${path}`, { method: 'POST', headers, body, credentials: 'same-origin' });
    const text = await res.text();
    let parsed = null;
    try { parsed = text ? JSON.parse(text) : null; } catch { /* not JSON: a proxy's page */ }
    return { ok: res.ok, status: res.status, error: parsed?.error ?? null };
  }

  /** The outbox database if this phone has one (never created here: Dexie creates it with its indexes). */
  function openOutbox() {
    return new Promise((resolve) => {
      const request = indexedDB.open('pollenpact-field');
      request.onupgradeneeded = () => request.transaction.abort();
      request.onerror = () => resolve(null);
      request.onsuccess = () => {
        const db = request.result;
        db.onversionchange = () => db.close(); // a newer app version upgrades it
        if (db.objectStoreNames.contains('records')) resolve(db);
        else { db.close(); resolve(null); }
      };
    });
  }

  function done(tx) {
    return new Promise((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
      tx.onabort = () => reject(tx.error ?? new Error('aborted'));
    });
  }

  /**
   * The next record to send, as the page's outbox picks it (the steps in the order recorded,
   * then the photos), marked sending in the same transaction; 'taken' when another sender
   * marked it sending within the lease.
   */
  async function takeNext(db, userId) {
    const tx = db.transaction('records', 'readwrite');
    const store = tx.objectStore('records');
    let next;
    store.getAll().onsuccess = (event) => {
      const open = event.target.result.filter((r) => r.userId === userId && (r.state === 'waiting' || r.state === 'sending'));
      const steps = open.filter((r) => r.kind !== 'photo');
      const record = (steps.length ? steps : open).sort((a, b) => a.seq - b.seq)[0];
      if (!record) return;
      if (record.state === 'sending' && Date.now() - Date.parse(record.sendingSince ?? '') < sendingLeaseMs) {
        next = 'taken';
        return;
      }
      next = { ...record, state: 'sending', attempts: record.attempts + 1, sendingSince: new Date().toISOString() };
      store.put(next);
    };
    await done(tx);
    return next;
  }

  async function update(db, seq, changes, removed = []) {
    const tx = db.transaction('records', 'readwrite');
    const store = tx.objectStore('records');
    store.get(seq).onsuccess = (event) => {
      const record = event.target.result;
      if (!record) return; // removed meanwhile
      const changed = { ...record, ...changes };
      for (const field of removed) delete changed[field];
      store.put(changed);
    };
    await done(tx);
  }
})();

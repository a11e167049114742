// Background Sync with no page open, in Debian's Chromium against the production build: a
// drop-off (and a photo, or the strength check after it) recorded without signal waits in the phone's outbox; the page is closed; when
// the browser fires the outbox's sync event (dispatched here through the DevTools
// protocol, `ServiceWorker.dispatchSyncEvent`, as the browser does once the signal
// returns) the service worker sends the record itself and marks it as the page's outbox
// does: sent (the server keeps it once), refused with the server's reason, or still
// waiting when the session has ended (the page then asks to sign in again).
// No signal is the browser's offline mode (what the page sees) and, under it, a cut of the
// connection to our server (tests/support/tcp-proxy.ts): the browser may fire the sync on
// its own at any moment, and its offline mode reaches a restarted service worker only a
// moment after its script runs, so nothing may get through before the signal returns.
// What reached the server is read where it arrives: from the proxy's log of requests and
// the server's own record of each answer (kept under the record's Idempotency-Key).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, type WatchedPage, typeNumber } from '../support/browser.js';
import { signedInClient } from '../support/api-client.js';
import { buildSignedSeason } from '../support/builders/season.js';
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import type { SeedWorld } from '../../seed/seed-world.js';
import { placementStateSet } from '../../shared/labels/placements.js';
import { solidPng } from '../support/test-png.js';
import { startTcpProxy, type TcpProxy } from '../support/tcp-proxy.js';

const poll = <T>(check: () => T | Promise<T>) => expect.poll(check, { timeout: 20_000, interval: 150 });

/** What the outbox keeps of each record, read inside the service worker (no page of the app open). */
interface StoredRecord { key: string; kind: string; state: string; attempts: number; error: string | null; recorded: { state: string } | null; sentAt: string | null }

describe('field records sent by the service worker under Background Sync', () => {
  let t: TestApp;
  let signal: TcpProxy;
  let baseUrl: string;
  let browser: Browser;
  const placements: { sent: string; signedOut: string; refused: string; checked: string } = { sent: '', signedOut: '', refused: '', checked: '' };
  const watched: WatchedPage[] = [];

  beforeAll(async () => {
    t = await startTestApp();
    signal = await startTcpProxy({ host: '127.0.0.1', port: t.port });
    baseUrl = `http://127.0.0.1:${signal.port}`;
    const world = { today: new Date(), extra: {} } as SeedWorld;
    await seedAccounts(world);
    const now = Date.now();
    for (const name of ['sent', 'signedOut', 'refused', 'checked'] as const) {
      const season = await buildSignedSeason({
        farm: world.organizations.farm, apiary: world.organizations.apiary, colonies: 16, delivered: false, minFramesOfBees: 6,
        onSite: { from: new Date(now + 86_400_000), to: new Date(now + 21 * 86_400_000) },
      });
      placements[name] = season.placement.id;
    }
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const [i, w] of watched.entries()) if (!w.page.isClosed()) await saveScreenshot(w.page, `field-background-sync-end-${i}`).catch(() => {});
    await browser?.close();
    await signal?.close();
    await t?.stop();
  });

  const rows = <T extends object>(sql: string, replacements: Record<string, unknown>) => t.context.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  /**
   * Signs the crew member in, records a drop-off (and a photo, or a strength check after it,
   * if asked) at the placement without signal, then closes the page.
   */
  async function dropOffOfflineAndClose(placementId: string, colonies: number, options: { photo?: boolean; framesOfBees?: number[] } = {}): Promise<BrowserContext> {
    const crew = await openWatchedPage(browser, { width: 412, height: 915, serviceWorkers: 'allow' });
    watched.push(crew);
    const { page, context } = crew;
    await signInThroughPage(page, baseUrl, 'crew@apiary.test', 'pollen-demo-2026');
    await page.goto(`${baseUrl}/placements/${placementId}`);
    await poll(() => page.evaluate(() => navigator.serviceWorker.ready.then(() => !!navigator.serviceWorker.controller))).toBe(true);
    await page.locator('#delivered-count').waitFor();

    signal.cut(10 * 60_000);
    await context.setOffline(true);
    await poll(() => page.evaluate(() => navigator.onLine)).toBe(false);
    if (options.photo) {
      await page.locator('#placement-photo').setInputFiles([{ name: 'pallets.png', mimeType: 'image/png', buffer: solidPng(640, 480, [82, 128, 61]) }]);
      await poll(() => page.getByTestId('pending-photo').count()).toBe(1);
    }
    await typeNumber(page.locator('#delivered-count'), colonies);
    await page.getByRole('button', { name: 'Mark dropped off' }).click();
    if (options.framesOfBees) {
      // Offline, the colonies count as on site on this phone: the strength check comes next.
      await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('1 record waiting to send');
      for (const [i, frames] of options.framesOfBees.entries()) await typeNumber(page.locator(`#frames-${i}`), frames);
      await page.locator(`#frames-${options.framesOfBees.length - 1}`).blur();
      await page.locator('form:has(#frames-0) button[type="submit"]').click();
    }
    const records = options.photo || options.framesOfBees ? 2 : 1;
    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe(records === 2 ? '2 records waiting to send' : '1 record waiting to send');
    // The page may have tried a record already (a send it began just before the signal went
    // fails at once): close it only once nothing is being sent, as a phone put away would be.
    await poll(async () => (await outboxOf(context)).map((r) => r.state)).toEqual(Array(records).fill('waiting'));
    expect(crew.externalRequests).toEqual([]);
    await page.close();
    return context;
  }

  /** The signal returns: our server is reachable again, and the browser leaves offline mode. */
  async function signalReturns(context: BrowserContext): Promise<void> {
    signal.restore();
    await context.setOffline(false);
  }

  /** The outbox's records, read through the service worker. */
  async function outboxOf(context: BrowserContext): Promise<StoredRecord[]> {
    const worker = context.serviceWorkers().find((w) => w.url().startsWith(baseUrl)) ?? (await context.waitForEvent('serviceworker'));
    return worker.evaluate(() => new Promise<StoredRecord[]>((resolve, reject) => {
      const open = indexedDB.open('pollenpact-field');
      open.onerror = () => reject(open.error);
      open.onsuccess = () => {
        const db = open.result;
        const all = db.transaction('records').objectStore('records').getAll();
        all.onerror = () => reject(all.error);
        all.onsuccess = () => {
          db.close();
          resolve((all.result as StoredRecord[]).map((r) => ({
            key: r.key, kind: r.kind, state: r.state, attempts: r.attempts, error: r.error ?? null, recorded: r.recorded ? { state: r.recorded.state } : null, sentAt: r.sentAt ?? null,
          })));
        };
      };
    }));
  }

  /**
   * Fires the outbox's sync event as the browser would, from `blank`: a page of the same
   * context that is not of the app's origin, so the worker sees no page of its own open.
   */
  async function dispatchOutboxSync(context: BrowserContext, blank: Page, times = 1): Promise<void> {
    const cdp = await context.newCDPSession(blank);
    const scope = `${baseUrl}/`;
    const registrationId = new Promise<string>((resolve) => {
      cdp.on('ServiceWorker.workerRegistrationUpdated', ({ registrations }) => {
        const mine = registrations.find((r) => r.scopeURL === scope && !r.isDeleted);
        if (mine) resolve(mine.registrationId);
      });
    });
    await cdp.send('ServiceWorker.enable');
    const id = await registrationId;
    await Promise.all(Array.from({ length: times }, () => cdp.send('ServiceWorker.dispatchSyncEvent', { origin: baseUrl, registrationId: id, tag: 'field-outbox', lastChance: false })));
    await cdp.detach();
  }

  /**
   * Fires the sync (`times` events at once) until the outbox is `settled`. A sync that fails
   * (the worker still without a connection the moment it wakes) is fired again, as the
   * browser retries a failed sync; each retry is logged. Returns the blank page it used.
   */
  async function syncUntil(context: BrowserContext, settled: (records: StoredRecord[]) => boolean, times = 1): Promise<Page> {
    const blank = await context.newPage();
    for (let round = 1; round <= 3; round++) {
      await dispatchOutboxSync(context, blank, times);
      for (const deadline = Date.now() + 10_000; Date.now() < deadline; await blank.waitForTimeout(150)) {
        if (settled(await outboxOf(context))) return blank;
      }
      console.warn(`field outbox not settled after sync ${round}:`, JSON.stringify(await outboxOf(context)), signal.httpRequests());
    }
    throw new Error('the outbox did not settle after three syncs');
  }

  /** The requests that reached our server from the phone since `from` (an index into the proxy's log). */
  const requestsSince = (from: number) => signal.httpRequests().slice(from);

  it('sends a drop-off and its photo with no page open, once each, and the outbox shows them sent', async () => {
    const id = placements.sent;
    const context = await dropOffOfflineAndClose(id, 14, { photo: true });
    const waiting = await outboxOf(context);
    // Recorded photo first, drop-off second; the step goes first all the same (as the page's outbox sends).
    expect(waiting).toMatchObject([{ kind: 'photo', state: 'waiting' }, { kind: 'delivery', state: 'waiting' }]);

    const from = signal.httpRequests().length;
    await signalReturns(context);
    // Two sync events at once (the browser's own and ours may meet): each record goes once.
    const blank = await syncUntil(context, (records) => records.every((r) => r.state === 'sent'), 2);
    const sent = await outboxOf(context);
    expect(sent).toMatchObject(waiting.map((r) => ({ key: r.key, state: 'sent', attempts: r.attempts + 1, error: null })));
    expect(sent.every((r) => r.sentAt)).toBe(true);
    // Each sync asks for a CSRF token; the session keeps one, so neither refuses the other's
    // send: the server is sent the drop-off, then its photo, once each.
    expect(requestsSince(from).filter((r) => r.startsWith('POST'))).toEqual([`POST /api/placements/${id}/delivery`, `POST /api/placements/${id}/photos`]);

    const [placement] = await rows<{ state: string; colonies_delivered: number; email: string }>(
      'SELECT p.state, p.colonies_delivered, u.email FROM placements p JOIN users u ON u.id = p.delivered_by WHERE p.id = :id', { id });
    expect(placement).toEqual({ state: 'delivered', colonies_delivered: 14, email: 'crew@apiary.test' });
    expect(await rows("SELECT id FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id", { id })).toHaveLength(1);
    // The photo as the page sends it: shrunk to JPEG on the phone, for the drop-off step.
    expect(await rows('SELECT content_type, step FROM placement_photos WHERE placement_id = :id', { id })).toEqual([{ content_type: 'image/jpeg', step: 'delivery' }]);
    expect(await rows('SELECT response_status FROM idempotency_keys WHERE key IN (:keys) ORDER BY response_status', { keys: waiting.map((r) => r.key) }))
      .toEqual([{ response_status: 201 }, { response_status: 201 }]);

    // Opened again, the page shows what the worker did.
    await blank.goto(`${baseUrl}/placements/${id}`);
    await poll(() => blank.getByTestId('outbox-waiting').textContent()).toBe('Everything recorded here is sent');
    expect(await blank.locator('.pp-outbox-item[data-state="sent"]').count()).toBe(2);
    await blank.close();
  });

  it('sends a drop-off and then its strength check with no page open, in the order recorded', async () => {
    const id = placements.checked;
    // 16 colonies: open at least 2 (10%, rounded up).
    const context = await dropOffOfflineAndClose(id, 16, { framesOfBees: [7, 8.5] });
    const waiting = await outboxOf(context);
    expect(waiting.map((r) => r.kind)).toEqual(['delivery', 'strength-check']);

    const from = signal.httpRequests().length;
    await signalReturns(context);
    const blank = await syncUntil(context, (records) => records.every((r) => r.state === 'sent'));
    expect(requestsSince(from).filter((r) => r.startsWith('POST'))).toEqual([`POST /api/placements/${id}/delivery`, `POST /api/placements/${id}/strength-checks`]);
    expect(await outboxOf(context)).toMatchObject(waiting.map((r) => ({ key: r.key, state: 'sent', attempts: r.attempts + 1, error: null })));
    expect(await rows('SELECT colonies_in_group, frames_of_bees FROM strength_checks WHERE placement_id = :id', { id })).toEqual([{ colonies_in_group: 16, frames_of_bees: [7, 8.5] }]);
    expect((await rows<{ state: string }>('SELECT state FROM placements WHERE id = :id', { id }))[0].state).toBe('delivered');
    await blank.close();
  });

  it('leaves the drop-off waiting when the session has ended, and the page asks to sign in again', async () => {
    const id = placements.signedOut;
    const context = await dropOffOfflineAndClose(id, 12);
    const [before] = await outboxOf(context);
    // The session ends on the server meanwhile (expired, or ended from another device).
    expect((await t.context.sequelize.query('DELETE FROM user_sessions RETURNING sid', { type: QueryTypes.SELECT })).length).toBeGreaterThan(0);

    const from = signal.httpRequests().length;
    await signalReturns(context);
    // The worker asks whether the session holds (it no longer does: 401) and sends nothing;
    // a send another sender began before the session ended (at most one attempt) ends waiting too.
    const blank = await syncUntil(context, (records) => requestsSince(from).includes('GET /api/auth/me') && records.every((r) => r.state === 'waiting'));
    await blank.waitForTimeout(1000);

    const [after] = await outboxOf(context);
    expect(after).toMatchObject({ kind: 'delivery', state: 'waiting', error: null });
    if (after.attempts !== before.attempts) console.warn(`field outbox: a send began before the session ended (attempts ${before.attempts} -> ${after.attempts})`, requestsSince(from));
    expect(after.attempts).toBeLessThanOrEqual(before.attempts + 1);
    // Nothing reached the placement.
    expect((await rows<{ state: string }>('SELECT state FROM placements WHERE id = :id', { id }))[0].state).toBe('scheduled');
    expect(await rows("SELECT id FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id", { id })).toEqual([]);

    // The page sends the crew member to sign in; once signed in, the record goes, once.
    await blank.goto(`${baseUrl}/placements/${id}`);
    await blank.waitForURL((url) => url.pathname === '/sign-in');
    await blank.getByLabel('E-mail').fill('crew@apiary.test');
    await blank.getByLabel('Password').fill('pollen-demo-2026');
    await blank.getByRole('button', { name: 'Sign in' }).click();
    await blank.waitForURL((url) => url.pathname === `/placements/${id}`);
    await poll(() => blank.getByTestId('outbox-waiting').textContent()).toBe('Everything recorded here is sent');
    expect((await rows<{ colonies_delivered: number }>('SELECT colonies_delivered FROM placements WHERE id = :id', { id }))[0].colonies_delivered).toBe(12);
    expect(await rows("SELECT id FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id", { id })).toHaveLength(1);
    await blank.close();
  });

  it('marks the drop-off refused with the server\'s reason when someone else dropped off meanwhile', async () => {
    const id = placements.refused;
    const context = await dropOffOfflineAndClose(id, 16);
    const [before] = await outboxOf(context);
    const keeper = await signedInClient(t.app, 'keeper@apiary.test');
    await keeper.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 9 }).expect(201);

    const from = signal.httpRequests().length;
    await signalReturns(context);
    const blank = await syncUntil(context, ([record]) => record?.state === 'rejected');
    // What the server answered the worker's one send, as it keeps it under the record's key.
    expect(requestsSince(from).filter((r) => r.startsWith('POST'))).toEqual([`POST /api/placements/${id}/delivery`]);
    const [answer] = await rows<{ response_status: number; response_body: { error: { message: string } } }>(
      'SELECT response_status, response_body FROM idempotency_keys WHERE key = :key', { key: before.key });
    expect(answer.response_status).toBe(409);
    const reason = answer.response_body.error.message;
    expect(await outboxOf(context)).toMatchObject([{ state: 'rejected', attempts: before.attempts + 1, error: reason, recorded: { state: 'delivered' } }]);

    // The page words it as its own outbox does: the reason, then what the server records.
    await blank.goto(`${baseUrl}/placements/${id}`);
    const shown = blank.locator('.pp-outbox-item[data-state="rejected"] .pp-outbox-error');
    await poll(() => shown.textContent()).toBe(`${reason} Recorded: ${placementStateSet.labels.delivered}. 9 colonies dropped off by Tobin Waxley.`);
    expect((await rows<{ colonies_delivered: number }>('SELECT colonies_delivered FROM placements WHERE id = :id', { id }))[0].colonies_delivered).toBe(9);
    await blank.close();
  });
});

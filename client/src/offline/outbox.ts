// The outbox: field records are stored first and sent after, in the order they were
// recorded, whether the phone has signal or not. Sending runs when a record is added, when
// the connection returns (`online`, or Background Sync through the service worker), when
// the app starts or comes back to the front, and again after a failed attempt. Each record
// keeps its Idempotency-Key across attempts, so the server keeps it once. Under Background
// Sync with no page in front, the service worker sends the same records the same way
// (client/public/field-sync-sw.js); each sender notes when it took a record (`sendingSince`).
// - no connection or a server error: the record waits and is tried again;
// - session expired (401): everything waits and the crew is asked to sign in again;
// - refused (4xx, e.g. the placement was cancelled or already delivered by someone else):
//   the record is marked refused with the reason and the rest go on; the crew may retry or remove it.
import { ref } from 'vue';
import { ApiError } from '@/api/http';
import { fieldRecordsApi } from '@/api/field-records';
import { newIdempotencyKey } from '@/api/idempotency-key';
import { messageOf } from '@/api/error-messages';
import type { PlacementDto } from '@shared/schemas/placements';
import { fieldDb, type FieldRecord } from './field-db';

const retryAfterMs = 30_000;
const keepSentForMs = 3 * 86_400_000;

/** True while sending waits for the crew member to sign in again. */
export const needsSignIn = ref(false);
/** Counts the service worker's sends: Dexie's live queries do not see its writes, so readers read again on a change. */
export const changedByWorker = ref(0);
let currentUserId: () => string | null = () => null;
let running: Promise<void> | null = null;
let retryTimer: ReturnType<typeof setTimeout> | null = null;

export type NewFieldRecord = Omit<FieldRecord, 'seq' | 'key' | 'state' | 'attempts' | 'error' | 'sentAt'>;

export async function addFieldRecord(record: NewFieldRecord): Promise<void> {
  // Plain data only: Vue's reactive proxies cannot be stored in IndexedDB; the photo stays a Blob.
  const { photo, ...fields } = record;
  const plain = JSON.parse(JSON.stringify(fields)) as Omit<NewFieldRecord, 'photo'>;
  await fieldDb.records.add({ ...plain, ...(photo ? { photo } : {}), key: newIdempotencyKey(), state: 'waiting', attempts: 0, error: null, sentAt: null });
  askBackgroundSync();
  void sendWaiting();
}

export async function retryFieldRecord(seq: number): Promise<void> {
  await fieldDb.records.update(seq, { state: 'waiting', error: null, recorded: null });
  askBackgroundSync();
  void sendWaiting();
}

/** Only a rejected record may be removed: nothing waiting is ever dropped. */
export async function removeRejectedRecord(seq: number): Promise<void> {
  await fieldDb.records.where({ seq }).and((r) => r.state === 'rejected').delete();
}

function askBackgroundSync() {
  if (!('serviceWorker' in navigator)) return;
  void navigator.serviceWorker.getRegistration().then((registration) => {
    const sync = (registration as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined)?.sync;
    return sync?.register('field-outbox');
  }).catch(() => { /* Background Sync refused: `online` and app start still send. */ });
}

function send(record: FieldRecord): Promise<{ placement: PlacementDto }> {
  switch (record.kind) {
    case 'delivery': return fieldRecordsApi.deliver(record.placementId, record.delivery!, record.key);
    case 'strength-check': return fieldRecordsApi.strengthCheck(record.placementId, record.strengthCheck!, record.key);
    case 'pickup': return fieldRecordsApi.pickup(record.placementId, record.pickup!, record.key);
    case 'photo': return fieldRecordsApi.photo(record.placementId, record.photo!, record.photoStep ?? 'delivery', record.recordedAt, record.key);
  }
}

/** What the server already records, on a refusal that says so (a 409 for a step already taken). */
function recordedOf(err: ApiError): PlacementDto | null {
  return (err.recorded as { placement?: PlacementDto } | undefined)?.placement ?? null;
}

function retryLater() {
  if (retryTimer) clearTimeout(retryTimer);
  retryTimer = setTimeout(() => { retryTimer = null; void sendWaiting(); }, retryAfterMs);
}

/** The steps in the order recorded, then the photos (heavier, and uploaded after their step). */
async function nextWaiting(userId: string): Promise<FieldRecord | undefined> {
  const open = await fieldDb.records.where('[userId+state]').anyOf([userId, 'waiting'], [userId, 'sending']).toArray();
  const steps = open.filter((r) => r.kind !== 'photo');
  return (steps.length ? steps : open).sort((a, b) => a.seq! - b.seq!)[0];
}

async function sendAll(): Promise<void> {
  for (;;) {
    const userId = currentUserId();
    if (!userId || !navigator.onLine) return;
    const record = await nextWaiting(userId);
    if (!record) return;
    await fieldDb.records.update(record.seq!, { state: 'sending', attempts: record.attempts + 1, sendingSince: new Date().toISOString() });
    try {
      await send(record);
      await fieldDb.records.update(record.seq!, { state: 'sent', sentAt: new Date().toISOString(), error: null, photo: record.kind === 'photo' ? undefined : record.photo });
      needsSignIn.value = false;
    } catch (err) {
      if (err instanceof ApiError && err.status === 401) {
        await fieldDb.records.update(record.seq!, { state: 'waiting' });
        needsSignIn.value = true;
        return;
      }
      if (err instanceof ApiError && err.status >= 400 && err.status < 500 && ![408, 425, 429].includes(err.status)) {
        await fieldDb.records.update(record.seq!, { state: 'rejected', error: messageOf(err), recorded: recordedOf(err) });
        continue;
      }
      // No connection, or the server could not answer: wait and try again.
      await fieldDb.records.update(record.seq!, { state: 'waiting' });
      retryLater();
      return;
    }
  }
}

/** Sends what waits, one record at a time; a call while sending joins the running one. */
export function sendWaiting(): Promise<void> {
  if (running) return running.then(() => sendWaiting());
  running = sendAll().finally(() => { running = null; });
  return running;
}

/** Starts the triggers once, at app start; `userId` reads the signed-in user. */
export function startFieldOutbox(userId: () => string | null): void {
  currentUserId = userId;
  window.addEventListener('online', () => void sendWaiting());
  document.addEventListener('visibilitychange', () => { if (document.visibilityState === 'visible') void sendWaiting(); });
  navigator.serviceWorker?.addEventListener('message', (event: MessageEvent<{ type?: string }>) => {
    if (event.data?.type === 'field-outbox:send') void sendWaiting();
    if (event.data?.type === 'field-outbox:changed') changedByWorker.value++;
  });
  void fieldDb.records.where('state').equals('sent').and((r) => Date.now() - Date.parse(r.sentAt ?? '') > keepSentForMs).delete();
}

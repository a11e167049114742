// The outbox as the field pages see it: every record of the signed-in crew member, live
// (Dexie's liveQuery follows changes from this tab, other tabs and the sending loop; the
// service worker's writes are read again when it says so),
// with what still waits, what was refused (and why, in words), and a placement's own pending records.
import { computed, onScopeDispose, shallowRef, watch } from 'vue';
import { liveQuery } from 'dexie';
import { fieldDb, type FieldRecord } from '@/offline/field-db';
import { changedByWorker, needsSignIn, retryFieldRecord, removeRejectedRecord, sendWaiting } from '@/offline/outbox';
import { refusalWords } from '@/offline/refusal-words';
import { useSessionStore } from '@/stores/session';

export function useFieldOutbox() {
  const session = useSessionStore();
  const records = shallowRef<FieldRecord[]>([]);
  const follow = () => liveQuery(() => fieldDb.records.orderBy('seq').toArray()).subscribe({
    next: (all) => { records.value = all.filter((r) => r.userId === session.user?.id); },
    error: () => { records.value = []; },
  });
  let subscription = follow();
  // The service worker sent records (Background Sync with no page in front): read them again.
  watch(changedByWorker, () => { subscription.unsubscribe(); subscription = follow(); });
  onScopeDispose(() => subscription.unsubscribe());

  const unsent = computed(() => records.value.filter((r) => r.state === 'waiting' || r.state === 'sending'));
  const rejected = computed(() => records.value.filter((r) => r.state === 'rejected'));
  /** Records of one placement not yet on the server (waiting or sending). */
  const pendingFor = (placementId: string) => unsent.value.filter((r) => r.placementId === placementId);

  return { records, unsent, rejected, pendingFor, refusalOf: refusalWords, needsSignIn, retry: retryFieldRecord, remove: removeRejectedRecord, sendNow: sendWaiting };
}

// The outbox as the field pages see it: every record of the signed-in crew member, live
// (Dexie's liveQuery follows changes from this tab, other tabs and the sending loop),
// with what still waits, what was refused, and a placement's own pending records.
import { computed, onScopeDispose, shallowRef } from 'vue';
import { liveQuery } from 'dexie';
import { fieldDb, type FieldRecord } from '@/offline/field-db';
import { needsSignIn, retryFieldRecord, removeRejectedRecord, sendWaiting } from '@/offline/outbox';
import { useSessionStore } from '@/stores/session';

export function useFieldOutbox() {
  const session = useSessionStore();
  const records = shallowRef<FieldRecord[]>([]);
  const subscription = liveQuery(() => fieldDb.records.orderBy('seq').toArray()).subscribe({
    next: (all) => { records.value = all.filter((r) => r.userId === session.user?.id); },
    error: () => { records.value = []; },
  });
  onScopeDispose(() => subscription.unsubscribe());

  const unsent = computed(() => records.value.filter((r) => r.state === 'waiting' || r.state === 'sending'));
  const rejected = computed(() => records.value.filter((r) => r.state === 'rejected'));
  /** Records of one placement not yet on the server (waiting or sending). */
  const pendingFor = (placementId: string) => unsent.value.filter((r) => r.placementId === placementId);

  return { records, unsent, rejected, pendingFor, needsSignIn, retry: retryFieldRecord, remove: removeRejectedRecord, sendNow: sendWaiting };
}

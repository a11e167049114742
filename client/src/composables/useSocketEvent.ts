// Listens to one server event for as long as the component (or effect scope) lives.
import { getCurrentScope, onScopeDispose } from 'vue';
import type { ServerToClientEvents } from '@shared/events';
import { onServerEvent } from '@/api/socket';

export function useSocketEvent<E extends keyof ServerToClientEvents>(event: E, handler: ServerToClientEvents[E]): () => void {
  const off = onServerEvent(event, handler);
  if (getCurrentScope()) onScopeDispose(off);
  return off;
}

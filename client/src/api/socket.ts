// The one socket.io connection, opened after sign-in with the session cookie, and the one
// way to listen to what the server announces on it.
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/events';

export type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
let socket: AppSocket | null = null;

export function connectSocket(): AppSocket {
  if (!socket) socket = io({ path: '/socket.io', withCredentials: true, transports: ['websocket', 'polling'] });
  else if (socket.disconnected) socket.connect();
  return socket;
}

export function disconnectSocket() {
  socket?.disconnect();
  socket = null;
}

export function currentSocket(): AppSocket | null {
  return socket;
}

type ServerEvent = keyof ServerToClientEvents;

/** Listens to one server event; returns the unsubscribe. Pages use useSocketEvent(), which unsubscribes on unmount. */
export function onServerEvent<E extends ServerEvent>(event: E, handler: ServerToClientEvents[E]): () => void {
  const live = connectSocket();
  live.on(event, handler as never);
  return () => live.off(event, handler as never);
}

// Alert calls and the live alert events: list (all, open, or changed since a revision),
// read, mark seen, answer; subscribe to raised/updated alerts and to reconnects.
import { http } from './http';
import { connectSocket } from './socket';
import type { AlertAnswer, AlertDto, AlertListDto } from '@shared/schemas/alerts';

export const alertsApi = {
  list: (query: { since?: number; state?: 'open' | 'all' } = {}) => http.get<AlertListDto>('/alerts', { query }),
  get: (id: string) => http.get<{ alert: AlertDto }>(`/alerts/${id}`),
  seen: (id: string) => http.post<{ alert: AlertDto }>(`/alerts/${id}/seen`),
  answer: (id: string, body: AlertAnswer) => http.post<{ alert: AlertDto }>(`/alerts/${id}/answer`, body),
};

/** Calls the handlers on live alerts and after each reconnect; returns the unsubscribe. */
export function onAlertEvents(handlers: { raised: (a: AlertDto) => void; updated: (a: AlertDto) => void; reconnected: () => void }): () => void {
  const socket = connectSocket();
  let connectedBefore = socket.connected;
  const onConnect = () => {
    if (connectedBefore) handlers.reconnected();
    connectedBefore = true;
  };
  socket.on('alert:raised', handlers.raised);
  socket.on('alert:updated', handlers.updated);
  socket.on('connect', onConnect);
  return () => {
    socket.off('alert:raised', handlers.raised);
    socket.off('alert:updated', handlers.updated);
    socket.off('connect', onConnect);
  };
}

// Hive request, commitment and yard calls, the calendar feed URL, and the live events of requests and commitments.
import { http } from './http';
import { connectSocket } from './socket';
import type { CommitmentBody, CommitmentDto, OpenRequestsQuery, RequestBody, RequestDetailDto, RequestSummaryDto } from '@shared/schemas/requests';
import type { YardBody, YardDto } from '@shared/schemas/yards';
import type { ServerToClientEvents } from '@shared/events';

type CommitResult = { commitment: CommitmentDto; coloniesOpen: number };

export const requestsApi = {
  list: (query: Partial<OpenRequestsQuery> = {}) => http.get<{ requests: RequestSummaryDto[] }>('/requests', { query }),
  get: (id: string) => http.get<{ request: RequestDetailDto }>(`/requests/${id}`),
  create: (body: RequestBody) => http.post<{ request: RequestDetailDto }>('/requests', body),
  update: (id: string, body: RequestBody) => http.put<{ request: RequestDetailDto }>(`/requests/${id}`, body),
  publish: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/publish`),
  withdraw: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/withdraw`),
  close: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/close`),
  commit: (id: string, body: CommitmentBody) => http.post<CommitResult>(`/requests/${id}/commitments`, body),
  myCommitments: () => http.get<{ commitments: CommitmentDto[] }>('/commitments'),
  acceptCommitment: (id: string) => http.post<CommitResult>(`/commitments/${id}/accept`),
  declineCommitment: (id: string) => http.post<CommitResult>(`/commitments/${id}/decline`),
  withdrawCommitment: (id: string) => http.post<CommitResult>(`/commitments/${id}/withdraw`),
  yards: () => http.get<{ yards: YardDto[] }>('/yards'),
  addYard: (body: YardBody) => http.post<{ yard: YardDto }>('/yards', body),
  removeYard: (id: string) => http.delete<void>(`/yards/${id}`),
  calendar: () => http.get<{ url: string | null }>('/calendar'),
  renewCalendar: () => http.post<{ url: string }>('/calendar/token'),
};

export const exportUrls = {
  requests: '/api/exports/requests.csv',
  agreements: '/api/exports/agreements.csv',
  placements: '/api/exports/placements.csv',
};

type Live = 'request:updated' | 'commitment:updated' | 'agreement:updated' | 'placement:updated';

/** Subscribes to one of the season's live events; returns the unsubscribe. */
export function onSeasonEvent<E extends Live>(event: E, handler: ServerToClientEvents[E]): () => void {
  const socket = connectSocket();
  socket.on(event, handler as never);
  return () => socket.off(event, handler as never);
}

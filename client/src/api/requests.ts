// Hive request calls (server module requests).
import { http } from './http';
import type { OpenRequestsQuery, RequestBody, RequestDetailDto, RequestSummaryDto } from '@shared/schemas/requests';

export const requestsApi = {
  list: (query: Partial<OpenRequestsQuery> = {}) => http.get<{ requests: RequestSummaryDto[] }>('/requests', { query }),
  get: (id: string) => http.get<{ request: RequestDetailDto }>(`/requests/${id}`),
  create: (body: RequestBody) => http.post<{ request: RequestDetailDto }>('/requests', body),
  update: (id: string, body: RequestBody) => http.put<{ request: RequestDetailDto }>(`/requests/${id}`, body),
  publish: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/publish`),
  withdraw: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/withdraw`),
  close: (id: string) => http.post<{ request: RequestDetailDto }>(`/requests/${id}/close`),
};

// Yard calls (server module yards): an apiary business's yards.
import { http } from './http';
import type { YardBody, YardDto } from '@shared/schemas/yards';

export const yardsApi = {
  list: () => http.get<{ yards: YardDto[] }>('/yards'),
  add: (body: YardBody) => http.post<{ yard: YardDto }>('/yards', body),
  remove: (id: string) => http.delete<void>(`/yards/${id}`),
};

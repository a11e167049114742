// Block calls (server module blocks): list, read, create, change, remove; forecast; bloom window revisions.
import { http } from './http';
import type { BlockBody, BlockDto, BlockForecastDto, BlockPatch, BloomWindowBody, BloomWindowDto, ForecastQuery } from '@shared/schemas/blocks';

export const blocksApi = {
  list: () => http.get<{ blocks: BlockDto[] }>('/blocks'),
  get: (id: string) => http.get<{ block: BlockDto }>(`/blocks/${id}`),
  create: (body: BlockBody) => http.post<{ block: BlockDto }>('/blocks', body),
  update: (id: string, body: BlockPatch) => http.patch<{ block: BlockDto }>(`/blocks/${id}`, body),
  remove: (id: string) => http.delete<void>(`/blocks/${id}`),
  forecast: (id: string, query: Partial<ForecastQuery> = {}) => http.get<{ forecast: BlockForecastDto }>(`/blocks/${id}/forecast`, { query }),
  bloomWindows: (id: string) => http.get<{ revisions: BloomWindowDto[] }>(`/blocks/${id}/bloom-windows`),
  publishBloomWindow: (id: string, body: BloomWindowBody) => http.post<{ bloomWindow: BloomWindowDto }>(`/blocks/${id}/bloom-windows`, body),
};

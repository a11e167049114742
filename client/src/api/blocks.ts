// Block calls: list, read, create, change, remove; forecast; bloom window revisions;
// stage thresholds and frost critical temperatures.
import { http } from './http';
import { connectSocket } from './socket';
import type { BloomRevisedEvent, BlockBody, BlockDto, BlockForecastDto, BlockPatch, BloomWindowBody, BloomWindowDto, ForecastQuery } from '@shared/schemas/blocks';
import type { FrostCriticalDto, StageThresholdBody, StageThresholdDto } from '@shared/schemas/weather';

export const blocksApi = {
  list: () => http.get<{ blocks: BlockDto[] }>('/blocks'),
  get: (id: string) => http.get<{ block: BlockDto }>(`/blocks/${id}`),
  create: (body: BlockBody) => http.post<{ block: BlockDto }>('/blocks', body),
  update: (id: string, body: BlockPatch) => http.patch<{ block: BlockDto }>(`/blocks/${id}`, body),
  remove: (id: string) => http.delete<void>(`/blocks/${id}`),
  forecast: (id: string, query: Partial<ForecastQuery> = {}) => http.get<{ forecast: BlockForecastDto }>(`/blocks/${id}/forecast`, { query }),
  bloomWindows: (id: string) => http.get<{ revisions: BloomWindowDto[] }>(`/blocks/${id}/bloom-windows`),
  publishBloomWindow: (id: string, body: BloomWindowBody) => http.post<{ bloomWindow: BloomWindowDto }>(`/blocks/${id}/bloom-windows`, body),
  stageThresholds: (crop?: string) => http.get<{ thresholds: StageThresholdDto[] }>('/bloom/stage-thresholds', { query: { crop } }),
  frostCritical: (crop?: string) => http.get<{ critical: FrostCriticalDto[] }>('/bloom/frost-critical', { query: { crop } }),
};

/** Calls handler on every live bloom-window revision this user may see; returns the unsubscribe. */
export function onBloomRevised(handler: (event: BloomRevisedEvent) => void): () => void {
  const socket = connectSocket();
  socket.on('bloom:revised', handler);
  return () => socket.off('bloom:revised', handler);
}

export const referenceApi = {
  addThreshold: (body: StageThresholdBody) => http.post<{ threshold: StageThresholdDto }>('/bloom/stage-thresholds', body),
  updateThreshold: (id: string, body: { label?: string; ddLowF?: number; ddHighF?: number; source?: string }) =>
    http.patch<{ threshold: StageThresholdDto }>(`/bloom/stage-thresholds/${id}`, body),
  updateFrostCritical: (id: string, body: { kill10F?: number; kill90F?: number; source?: string }) =>
    http.patch<{ critical: FrostCriticalDto }>(`/bloom/frost-critical/${id}`, body),
};

// Bloom reference calls (server module bloom): stage thresholds and frost critical temperatures.
import { http } from './http';
import type { FrostCriticalDto, StageThresholdBody, StageThresholdDto } from '@shared/schemas/weather';

export const bloomApi = {
  stageThresholds: (crop?: string) => http.get<{ thresholds: StageThresholdDto[] }>('/bloom/stage-thresholds', { query: { crop } }),
  frostCritical: (crop?: string) => http.get<{ critical: FrostCriticalDto[] }>('/bloom/frost-critical', { query: { crop } }),
  addThreshold: (body: StageThresholdBody) => http.post<{ threshold: StageThresholdDto }>('/bloom/stage-thresholds', body),
  updateThreshold: (id: string, body: { label?: string; ddLowF?: number; ddHighF?: number; source?: string }) =>
    http.patch<{ threshold: StageThresholdDto }>(`/bloom/stage-thresholds/${id}`, body),
  updateFrostCritical: (id: string, body: { kill10F?: number; kill90F?: number; source?: string }) =>
    http.patch<{ critical: FrostCriticalDto }>(`/bloom/frost-critical/${id}`, body),
};

// Spray plan calls: list, read (with its conflicts and buffer), the dry-run check, plan,
// change or move, record as applied, cancel; and the pest timing behind a spray.
import { http } from './http';
import type { SprayApply, SprayCheckResult, SprayDto, SprayInput, SprayState, SprayUpdate, SprayWithCheck } from '@shared/schemas/sprays';
import type { PestModelDto, PestTimingDto, TrapCountDto, TrapCountInput } from '@shared/schemas/pests';

export const spraysApi = {
  list: (state?: SprayState) => http.get<{ sprays: SprayDto[] }>('/sprays', { query: { state } }),
  get: (id: string) => http.get<SprayWithCheck>(`/sprays/${id}`),
  check: (body: SprayInput) => http.post<{ check: SprayCheckResult }>('/sprays/check', body),
  create: (body: SprayInput) => http.post<SprayWithCheck>('/sprays', body),
  update: (id: string, body: SprayUpdate) => http.patch<SprayWithCheck>(`/sprays/${id}`, body),
  apply: (id: string, body: SprayApply) => http.post<SprayWithCheck>(`/sprays/${id}/apply`, body),
  cancel: (id: string) => http.post<SprayWithCheck>(`/sprays/${id}/cancel`),
};

export const pestsApi = {
  models: () => http.get<{ models: PestModelDto[] }>('/pests/models'),
  trapCounts: (blockId: string, pestModelId = 'codling-moth') => http.get<{ trapCounts: TrapCountDto[] }>('/pests/trap-counts', { query: { blockId, pestModelId } }),
  recordTrapCount: (body: TrapCountInput) => http.post<{ trapCount: TrapCountDto }>('/pests/trap-counts', body),
  timing: (blockId: string, pestModelId = 'codling-moth') => http.get<{ timing: PestTimingDto }>('/pests/timing', { query: { blockId, pestModelId } }),
};

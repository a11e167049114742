// Pest model calls (server module pests): the models, a block's trap counts, and the timing they give.
import { http } from './http';
import type { PestModelDto, PestTimingDto, TrapCountDto, TrapCountInput } from '@shared/schemas/pests';

export const pestsApi = {
  models: () => http.get<{ models: PestModelDto[] }>('/pests/models'),
  trapCounts: (blockId: string, pestModelId = 'codling-moth') => http.get<{ trapCounts: TrapCountDto[] }>('/pests/trap-counts', { query: { blockId, pestModelId } }),
  recordTrapCount: (body: TrapCountInput) => http.post<{ trapCount: TrapCountDto }>('/pests/trap-counts', body),
  /** One season of the farm (its calendar year); this season when left out. */
  timing: (blockId: string, pestModelId = 'codling-moth', season?: number) => http.get<{ timing: PestTimingDto }>('/pests/timing', { query: { blockId, pestModelId, season } }),
};

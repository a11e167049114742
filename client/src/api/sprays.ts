// Spray plan calls: list, read (with its conflicts and buffer), the dry-run check, plan,
// change or move, record as applied, cancel.
import { http } from './http';
import type { SprayApply, SprayCheckResult, SprayDto, SprayInput, SprayState, SprayUpdate, SprayWithCheck } from '@shared/schemas/sprays';

export const spraysApi = {
  list: (state?: SprayState) => http.get<{ sprays: SprayDto[] }>('/sprays', { query: { state } }),
  get: (id: string) => http.get<SprayWithCheck>(`/sprays/${id}`),
  check: (body: SprayInput) => http.post<{ check: SprayCheckResult }>('/sprays/check', body),
  /** `key`: the Idempotency-Key, so the same plan sent again (after a lost answer) is kept once. */
  create: (body: SprayInput, key: string) => http.post<SprayWithCheck>('/sprays', body, { headers: { 'Idempotency-Key': key } }),
  update: (id: string, body: SprayUpdate) => http.patch<SprayWithCheck>(`/sprays/${id}`, body),
  apply: (id: string, body: SprayApply) => http.post<SprayWithCheck>(`/sprays/${id}/apply`, body),
  cancel: (id: string) => http.post<SprayWithCheck>(`/sprays/${id}/cancel`),
};

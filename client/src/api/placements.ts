// Field calls for placements: delivery, strength checks, photos, pickup, disputes.
import { http } from './http';
import type { DeliveryBody, DisputeBody, PickupBody, PlacementDto, StrengthCheckBody } from '@shared/schemas/placements';

export const placementsApi = {
  list: (agreementId?: string) => http.get<{ placements: PlacementDto[] }>('/placements', { query: { agreementId } }),
  get: (id: string) => http.get<{ placement: PlacementDto }>(`/placements/${id}`),
  deliver: (id: string, body: DeliveryBody) => http.post<{ placement: PlacementDto }>(`/placements/${id}/delivery`, body),
  pickup: (id: string, body: PickupBody) => http.post<{ placement: PlacementDto }>(`/placements/${id}/pickup`, body),
  strengthCheck: (id: string, body: StrengthCheckBody) => http.post<{ placement: PlacementDto }>(`/placements/${id}/strength-checks`, body),
  dispute: (id: string, body: DisputeBody) => http.post<{ placement: PlacementDto }>(`/placements/${id}/dispute`, body),
  addPhoto: (id: string, photo: File, step: 'delivery' | 'strength-check' | 'pickup') => {
    const form = new FormData();
    form.append('step', step);
    form.append('photo', photo);
    return http.post<{ placement: PlacementDto }>(`/placements/${id}/photos`, form);
  },
};

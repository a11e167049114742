// Sends one field record from the phone's outbox: the step's body with the phone's own
// Idempotency-Key, so a record sent twice (an answer lost on a weak signal) is kept once.
// A 401 is left to the outbox (it waits and asks to sign in again) instead of leaving the page.
import { http } from './http';
import type { DeliveryBody, PickupBody, PlacementDto, StrengthCheckBody } from '@shared/schemas/placements';

type Answer = Promise<{ placement: PlacementDto }>;
const options = (key: string) => ({ headers: { 'Idempotency-Key': key }, quiet401: true });

export const fieldRecordsApi = {
  deliver: (placementId: string, body: DeliveryBody, key: string): Answer => http.post(`/placements/${placementId}/delivery`, body, options(key)),
  strengthCheck: (placementId: string, body: StrengthCheckBody, key: string): Answer => http.post(`/placements/${placementId}/strength-checks`, body, options(key)),
  pickup: (placementId: string, body: PickupBody, key: string): Answer => http.post(`/placements/${placementId}/pickup`, body, options(key)),
  photo: (placementId: string, photo: Blob, step: 'delivery' | 'strength-check' | 'pickup', recordedAt: string, key: string): Answer => {
    const form = new FormData();
    form.append('step', step);
    form.append('recordedAt', recordedAt);
    form.append('photo', photo, `${step}.${photo.type === 'image/png' ? 'png' : photo.type === 'image/webp' ? 'webp' : 'jpg'}`);
    return http.post(`/placements/${placementId}/photos`, form, options(key));
  },
};

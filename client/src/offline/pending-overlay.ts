// A placement as the crew member sees it before the server has their records: a drop-off
// waiting in the outbox makes the colonies on site (so the strength check and pickup can
// be recorded next, still offline); a pickup waiting makes them picked up. The server's
// answer replaces this view as soon as the records are sent.
import type { PlacementDto } from '@shared/schemas/placements';
import type { FieldRecord } from './field-db';

export function withPending(placement: PlacementDto, pending: FieldRecord[]): PlacementDto {
  let view = placement;
  const delivery = pending.find((r) => r.kind === 'delivery');
  if (delivery?.delivery && view.state === 'scheduled') {
    view = {
      ...view, state: 'delivered', coloniesDelivered: delivery.delivery.coloniesDelivered, deliveredAt: delivery.recordedAt,
      deliveredByName: null, onSite: { from: delivery.recordedAt, to: null },
    };
  }
  const pickup = pending.find((r) => r.kind === 'pickup');
  if (pickup?.pickup && view.state === 'delivered') {
    view = { ...view, state: 'picked-up', coloniesPickedUp: pickup.pickup.coloniesPickedUp, pickedUpAt: pickup.recordedAt, pickedUpByName: null, onSite: { ...view.onSite, to: pickup.recordedAt } };
  }
  return view;
}

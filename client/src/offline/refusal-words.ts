// A refused field record in words: the server's reason, and what the server already
// records when it says so (a drop-off taken by someone else meanwhile). The words are made
// here when shown, not when stored, so a refusal kept by the page's outbox and one kept by
// the service worker (client/public/field-sync-sw.js, which has no labels) read the same.
import { placementStateSet } from '@shared/labels/placements';
import type { FieldRecord } from './field-db';

export function refusalWords(record: Pick<FieldRecord, 'error' | 'recorded'>): string {
  const reason = record.error ?? 'The request failed.';
  const placement = record.recorded;
  if (!placement) return reason;
  const delivered = placement.coloniesDelivered != null ? ` ${placement.coloniesDelivered} colonies dropped off${placement.deliveredByName ? ` by ${placement.deliveredByName}` : ''}.` : '';
  return `${reason} Recorded: ${placementStateSet.labels[placement.state]}.${delivered}`;
}

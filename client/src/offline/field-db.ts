// The phone's outbox for field records, in IndexedDB through Dexie: deliveries, strength
// checks, pickups and photos recorded without signal survive a reload, a closed tab and a
// restarted phone until the server has them. Photos are kept as Blobs beside their record.
// Two writers keep the same fields: the page's outbox (outbox.ts) and, under Background
// Sync with no page in front, the service worker (client/public/field-sync-sw.js, plain
// IndexedDB on this database and store); a change of fields here is a change there too.
import Dexie, { type EntityTable } from 'dexie';
import type { GeoPoint } from '@shared/schemas/common';
import type { DeliveryBody, PickupBody, PlacementDto, StrengthCheckBody } from '@shared/schemas/placements';

export type FieldRecordKind = 'delivery' | 'strength-check' | 'pickup' | 'photo';
/** waiting: not sent yet (or to be sent again); sending: on its way; sent: the server has it; rejected: the server refused it. */
export type FieldRecordState = 'waiting' | 'sending' | 'sent' | 'rejected';
export type PhotoStep = 'delivery' | 'strength-check' | 'pickup';

export interface FieldRecord {
  /** Order of recording: records are sent in this order. */
  seq?: number;
  /** The phone's Idempotency-Key for this record; the same on every attempt. */
  key: string;
  userId: string;
  placementId: string;
  /** For the outbox list: which drop site. */
  siteName: string;
  kind: FieldRecordKind;
  delivery?: DeliveryBody;
  strengthCheck?: StrengthCheckBody;
  pickup?: PickupBody;
  photo?: Blob;
  photoStep?: PhotoStep;
  /** When the crew recorded it, by the phone's clock (ISO). */
  recordedAt: string;
  position?: GeoPoint | null;
  accuracyM?: number | null;
  state: FieldRecordState;
  attempts: number;
  /** Why the server refused it (rejected): the server's message (shown with `recorded` by refusal-words.ts). */
  error?: string | null;
  /** On a refusal for a step already taken: the placement as the server records it. */
  recorded?: PlacementDto | null;
  /** When a sender last marked it sending (ISO): the service worker leaves a record another sender took moments ago. */
  sendingSince?: string | null;
  sentAt?: string | null;
}

export const fieldDb = new Dexie('pollenpact-field') as Dexie & { records: EntityTable<FieldRecord, 'seq'> };
fieldDb.version(1).stores({ records: '++seq, &key, [userId+state], placementId, state' });

// Placements in the field: delivery, strength checks, pickup and disputes.
import { z } from 'zod';
import { isoDateTimeSchema, pointSchema, type GeoPoint } from './common.js';
import type { StrengthSummary } from '../domain/strength-check.js';

export const placementStates = ['scheduled', 'delivered', 'picked-up'] as const;
export type PlacementState = (typeof placementStates)[number];

const count = z.int('must be a whole number').min(0, 'must be zero or more').max(100_000);
const frames = z.number('must be a number').min(0, 'must be zero or more').max(30, 'is at most 30');

export const deliveryBody = z.object({
  coloniesDelivered: count,
  deliveredAt: isoDateTimeSchema.optional(),
  location: pointSchema.nullable().optional(),
  /** How far off the phone's position may be, in metres (as the phone reports it). */
  accuracyM: z.number('must be a number').min(0, 'must be zero or more').max(100_000).nullable().optional(),
});
export type DeliveryBody = z.input<typeof deliveryBody>;

export const pickupBody = z.object({
  coloniesPickedUp: count,
  pickedUpAt: isoDateTimeSchema.optional(),
});
export type PickupBody = z.input<typeof pickupBody>;

export const strengthCheckBody = z.object({
  framesOfBees: z.array(frames).min(1, 'record at least one colony').max(10_000),
  framesOfBrood: z.array(frames).max(10_000).nullable().optional(),
  coloniesInGroup: z.int().min(1, 'must be at least 1').max(100_000).optional(),
  inspectorName: z.string().trim().max(120).nullable().optional(),
  notes: z.string().trim().max(2000).nullable().optional(),
  checkedAt: isoDateTimeSchema.optional(),
});
export type StrengthCheckBody = z.input<typeof strengthCheckBody>;

// Refusals name the steps as people see them (fieldStepSet in shared/labels/placements.ts),
// never by their stored codes.
export const disputeBody = z.object({
  step: z.enum(['delivery', 'pickup'], 'must be drop-off or pickup'),
  countedColonies: count.nullable().optional(),
  note: z.string().trim().min(1, 'is required').max(2000),
});
export type DisputeBody = z.input<typeof disputeBody>;

export const photoParams = z.object({ id: z.uuid('must be a valid id'), photoId: z.uuid('must be a valid id') });
export const photoStepBody = z.object({ step: z.enum(['delivery', 'strength-check', 'pickup'], 'must be drop-off, strength check or pickup').default('delivery'), recordedAt: isoDateTimeSchema.optional() });

export interface StrengthCheckDto {
  id: string;
  checkedAt: string;
  checkedByName: string | null;
  inspectorName: string | null;
  coloniesInGroup: number;
  framesOfBees: number[];
  framesOfBrood: number[] | null;
  notes: string | null;
  /** When the check reached the server (checkedAt is when it was recorded in the field). */
  receivedAt?: string | null;
  summary: StrengthSummary;
}

export interface PlacementDto {
  id: string;
  agreementId: string;
  requestId: string;
  requestTitle: string;
  farmName: string;
  apiaryName: string;
  state: PlacementState;
  dropSite: { id: string; name: string; location: GeoPoint; gateCode: string | null; vehicleAccess: string | null; accessNotes: string | null; waterSource: string | null };
  blockName: string;
  coloniesPlanned: number;
  minFramesOfBees: number;
  onSite: { from: string | null; to: string | null };
  coloniesDelivered: number | null;
  deliveredAt: string | null;
  deliveredLocation: GeoPoint | null;
  deliveredByName: string | null;
  /** The phone's own times beside the server's: a record sent late shows both. */
  deliveredRecordedAt?: string | null;
  deliveredReceivedAt?: string | null;
  deliveredAccuracyM?: number | null;
  coloniesPickedUp: number | null;
  pickedUpAt: string | null;
  pickedUpByName: string | null;
  pickedUpRecordedAt?: string | null;
  pickedUpReceivedAt?: string | null;
  dispute: { step: 'delivery' | 'pickup' | null; countedColonies: number | null; note: string; byName: string | null; at: string } | null;
  strengthChecks: StrengthCheckDto[];
  photos: Array<{ id: string; step: string; url: string; at: string; recordedAt?: string | null }>;
}

// Hive requests and commitments: what a grower asks for and what beekeepers offer.
import { z } from 'zod';
import { idSchema, isDaysApartAtMost, isoDateSchema, maxWindowDays, pointSchema, type GeoPoint } from './common.js';

export const requestStates = ['draft', 'listed', 'filled', 'closed', 'withdrawn'] as const;
export type RequestState = (typeof requestStates)[number];

const optionalText = (max: number) => z.string().trim().max(max, `is at most ${max} characters`).nullable().optional();
const cents = z.int('must be rounded to the cent').min(0, 'must be zero or more').max(100_000_000, 'is too large');
// Stored in basis points (1/100 of a percent); a person reads and types percentages.
const basisPoints = (max: number) => z.int('must be a percentage with at most two decimals').min(0, 'must be zero or more').max(max, `is at most ${max / 100}%`);

export const dropSiteInput = z.object({
  blockId: idSchema,
  name: z.string().trim().min(1, 'is required').max(120),
  location: pointSchema,
  coloniesPlanned: z.int('must be a whole number').min(1, 'must be at least 1').max(100_000),
  accessNotes: optionalText(1000),
  vehicleAccess: optionalText(500),
  gateCode: optionalText(60),
  waterSource: optionalText(500),
});
export type DropSiteInput = z.infer<typeof dropSiteInput>;

export const arriveRuleSchema = z.discriminatedUnion('rule', [
  z.object({ rule: z.literal('bloom-stage'), bloomPercent: z.int('must be a whole percent').min(0).max(100, 'is at most 100') }),
  z.object({ rule: z.literal('date'), on: isoDateSchema }),
]);
export const departRuleSchema = z.discriminatedUnion('rule', [
  z.object({ rule: z.literal('petal-fall') }),
  z.object({ rule: z.literal('date'), on: isoDateSchema }),
]);

export const requestBody = z.object({
  title: z.string().trim().min(1, 'is required').max(160),
  blocks: z
    .array(z.object({ blockId: idSchema, colonies: z.int('must be a whole number').min(1, 'must be at least 1').max(100_000) }))
    .min(1, 'choose at least one block')
    .refine((list) => new Set(list.map((b) => b.blockId)).size === list.length, 'lists a block twice'),
  minFramesOfBees: z.number('must be a number').min(0, 'must be zero or more').max(30, 'is at most 30'),
  minFramesOfBrood: z.number('must be a number').min(0).max(30, 'is at most 30').nullable().optional(),
  arrive: arriveRuleSchema,
  depart: departRuleSchema,
  pricePerColonyCents: cents,
  currency: z.string().regex(/^[A-Z]{3}$/, 'must be a three-letter currency code').default('USD'),
  depositShareBp: basisPoints(10_000).default(5000),
  balanceDueDays: z.int().min(0).max(365, 'is at most 365').default(30),
  lateInterestBpPerMonth: basisPoints(2000).default(100),
  belowMinimumRateBp: basisPoints(10_000).default(0),
  extraMoveFeeCents: cents.default(0),
  noticeHours: z.int().min(0).max(720, 'is at most 720').default(48),
  respondBy: isoDateSchema.nullable().optional(),
  notes: optionalText(4000),
  dropSites: z.array(dropSiteInput).max(50).default([]),
}).refine(
  (b) => isDaysApartAtMost('on' in b.arrive ? b.arrive.on : undefined, 'on' in b.depart ? b.depart.on : undefined, maxWindowDays.season),
  { path: ['depart', 'on'], message: `must be at most ${maxWindowDays.season} days after the arrival date` },
);
export type RequestBody = z.input<typeof requestBody>;
export type ParsedRequestBody = z.output<typeof requestBody>;

export const openRequestsQuery = z.object({
  crop: z.string().trim().max(40).optional(),
  maxDistanceKm: z.coerce.number('must be a number').positive('must be more than 0').max(5000).optional(),
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
});
export type OpenRequestsQuery = z.infer<typeof openRequestsQuery>;

export const commitmentBody = z.object({
  colonies: z.int('must be a whole number').min(1, 'must be at least 1').max(100_000),
  proposedPriceCents: cents.nullable().optional(),
  note: optionalText(1000),
});
export type CommitmentBody = z.input<typeof commitmentBody>;

export const commitmentStates = ['offered', 'accepted', 'declined', 'withdrawn'] as const;
export type CommitmentState = (typeof commitmentStates)[number];

export interface DropSiteDto {
  id: string;
  blockId: string;
  name: string;
  location: GeoPoint;
  coloniesPlanned: number;
  accessNotes: string | null;
  vehicleAccess: string | null;
  waterSource: string | null;
  /** Null for a beekeeper until an agreement with them is in force. */
  gateCode: string | null;
  gateCodeHidden: boolean;
}

export interface RequestBlockDto {
  blockId: string;
  name: string;
  crop: string;
  acres: number;
  colonies: number;
  bloomWindow: { bloomStart: string; fullBloom: string | null; petalFall: string } | null;
}

export interface CommitmentDto {
  id: string;
  requestId: string;
  apiaryId: string;
  apiaryName: string;
  colonies: number;
  proposedPriceCents: number | null;
  state: CommitmentState;
  note: string | null;
  agreementId: string | null;
  createdAt: string;
}

export interface RequestSummaryDto {
  id: string;
  farmId: string;
  farmName: string;
  title: string;
  state: RequestState;
  coloniesRequested: number;
  coloniesCommitted: number;
  coloniesOpen: number;
  crops: string[];
  minFramesOfBees: number;
  minFramesOfBrood: number | null;
  expectedOnSite: { from: string; to: string } | null;
  pricePerColonyCents: number;
  currency: string;
  respondBy: string | null;
  /** From the viewing apiary's nearest yard; null for growers or without yards. */
  distanceKm: number | null;
}

export interface RequestEventDto {
  id: string;
  action: string;
  actorName: string | null;
  detail: Record<string, unknown>;
  at: string;
}

export interface RequestDetailDto extends RequestSummaryDto {
  arrive: z.infer<typeof arriveRuleSchema>;
  depart: z.infer<typeof departRuleSchema>;
  depositShareBp: number;
  balanceDueDays: number;
  lateInterestBpPerMonth: number;
  belowMinimumRateBp: number;
  extraMoveFeeCents: number;
  noticeHours: number;
  notes: string | null;
  blocks: RequestBlockDto[];
  dropSites: DropSiteDto[];
  commitments: CommitmentDto[];
  events: RequestEventDto[];
}

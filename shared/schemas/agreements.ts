// Pollination agreements and their amendments.
import { z } from 'zod';
import { isoDateTimeSchema, maxWindowDays, windowAtMost } from './common.js';
import type { AgreementClause } from '../domain/agreement-clauses.js';

export const agreementStates = ['awaiting-signatures', 'in-force', 'completed', 'cancelled'] as const;
export type AgreementState = (typeof agreementStates)[number];

/** The terms an amendment may change; at least one. */
export const amendmentChanges = z
  .object({
    pricePerColonyCents: z.int('must be rounded to the cent').min(0).max(100_000_000).optional(),
    expectedOnSite: z
      .object({ from: isoDateTimeSchema, to: isoDateTimeSchema })
      .refine((w) => Date.parse(w.to) > Date.parse(w.from), { message: 'must end after it starts', path: ['to'] })
      .refine(...windowAtMost('from', 'to', maxWindowDays.season))
      .optional(),
    noticeHours: z.int().min(0).max(720, 'is at most 720').optional(),
    removalNoticeHours: z.int().min(0).max(720, 'is at most 720').optional(),
    minFramesOfBees: z.number().min(0).max(30).optional(),
    extraMoveFeeCents: z.int().min(0).max(100_000_000).optional(),
  })
  .strict()
  .refine((c) => Object.keys(c).length > 0, 'change at least one term');
export type AmendmentChanges = z.infer<typeof amendmentChanges>;

export const amendmentBody = z.object({
  changes: amendmentChanges,
  reason: z.string().trim().min(1, 'is required').max(1000),
});
export type AmendmentBody = z.input<typeof amendmentBody>;

export const amendmentParams = z.object({ id: z.uuid('must be a valid id'), amendmentId: z.uuid('must be a valid id') });

export interface PartyConfirmation {
  byName: string | null;
  at: string | null;
}

export interface AmendmentDto {
  id: string;
  state: 'proposed' | 'accepted' | 'rejected' | 'withdrawn';
  changes: AmendmentChanges;
  previous: Record<string, unknown>;
  reason: string;
  proposedSide: 'farm' | 'apiary';
  proposedByName: string | null;
  decidedByName: string | null;
  decidedAt: string | null;
  versionAfter: number | null;
  createdAt: string;
}

export interface AgreementDto {
  id: string;
  requestId: string;
  requestTitle: string;
  commitmentId: string;
  farmId: string;
  farmName: string;
  apiaryId: string;
  apiaryName: string;
  state: AgreementState;
  version: number;
  colonies: number;
  pricePerColonyCents: number;
  currency: string;
  minFramesOfBees: number;
  minFramesOfBrood: number | null;
  expectedOnSite: { from: string; to: string };
  noticeHours: number;
  removalNoticeHours: number;
  depositShareBp: number;
  balanceDueDays: number;
  lateInterestBpPerMonth: number;
  belowMinimumRateBp: number;
  extraMoveFeeCents: number;
  clauses: AgreementClause[];
  blocks: Array<{ id: string; name: string; crop: string }>;
  farmConfirmation: PartyConfirmation;
  apiaryConfirmation: PartyConfirmation;
  amendments: AmendmentDto[];
  createdAt: string;
}

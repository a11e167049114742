// Conflict alerts: states, the answer a side gives, the list query and the DTOs.
import { z } from 'zod';
import type { ConflictGrade } from '../domain/conflict-grading.js';
import type { ConflictColonies, SprayState } from './sprays.js';

export const alertStates = ['raised', 'seen', 'answered', 'resolved'] as const;
export type AlertState = (typeof alertStates)[number];
export const alertActions = ['raised', 'updated', 'seen', 'answered', 'resolved', 'reopened'] as const;
export type AlertAction = (typeof alertActions)[number];

/** Answers a beekeeper or a grower can give; each side has its own. */
export const apiaryResponses = ['will-move-colonies', 'will-close-colonies', 'noted'] as const;
export const farmResponses = ['will-reschedule', 'will-change-product', 'noted'] as const;
export const alertResponses = ['will-move-colonies', 'will-close-colonies', 'will-reschedule', 'will-change-product', 'noted'] as const;
export type AlertResponse = (typeof alertResponses)[number];

export const alertAnswerSchema = z.object({
  response: z.enum(alertResponses, { message: 'must be one of the listed answers' }),
  note: z.string().trim().max(2000, 'must be at most 2000 characters').nullish().transform((v) => (v ? v : null)),
});
export type AlertAnswer = z.infer<typeof alertAnswerSchema>;

export const alertListQuery = z.object({
  /** Only alerts changed after this revision (what a reconnecting client missed). */
  since: z.coerce.number({ message: 'must be a revision number' }).int('must be a whole number').min(0, 'must be zero or more').optional(),
  state: z.enum(['open', 'all']).default('all'),
});
export type AlertListQuery = z.infer<typeof alertListQuery>;

/** What the check found for the alert, kept with it. */
export interface AlertFinding {
  colonies: ConflictColonies | null;
  duringBloom: boolean;
  residualHours: number;
  bufferM: number;
}

export interface AlertEventDto {
  id: string;
  action: AlertAction;
  actorName: string | null;
  organizationName: string | null;
  response: AlertResponse | null;
  note: string | null;
  at: string;
}

export interface AlertDto {
  id: string;
  revision: number;
  state: AlertState;
  grade: ConflictGrade;
  grades: ConflictGrade[];
  reasons: string[];
  cautions: string[];
  /** timeZone: the farm's, in which its sprays are planned and shown. */
  farm: { id: string; name: string; timeZone: string };
  apiary: { id: string; name: string } | null;
  spray: { id: string; state: SprayState; productName: string; epaRegNo: string | null; startsAt: string; endsAt: string; blockNames: string[] };
  findings: AlertFinding;
  /** Whether the viewer's organization has seen it. */
  seenByMe: boolean;
  raisedAt: string;
  resolvedAt: string | null;
  updatedAt: string;
  history: AlertEventDto[];
}

export interface AlertListDto {
  alerts: AlertDto[];
  /** The highest revision the viewer may see: send it back as `since` after a reconnect. */
  latestRevision: number;
  unseen: number;
}

// Sign-in, sign-up and the signed-in user as the API returns it.
import { z } from 'zod';
import { emailSchema, unitsSchema, timeZoneSchema } from './common.js';
import { organizationKinds } from '../roles.js';

export const passwordSchema = z.string().min(10, 'must be at least 10 characters').max(200, 'must be at most 200 characters');

export const loginBody = z.object({
  email: emailSchema,
  password: z.string().min(1, 'is required').max(200),
});
export type LoginBody = z.infer<typeof loginBody>;

export const signupBody = z.object({
  name: z.string().trim().min(1, 'is required').max(120),
  email: emailSchema,
  password: passwordSchema,
  organization: z.object({
    name: z.string().trim().min(1, 'is required').max(160),
    kind: z.enum(organizationKinds),
    timeZone: timeZoneSchema.default('America/Los_Angeles'),
  }),
});
export type SignupBody = z.infer<typeof signupBody>;

export const preferencesBody = z.object({
  units: unitsSchema.optional(),
  timeZone: timeZoneSchema.nullable().optional(),
});
export type PreferencesBody = z.infer<typeof preferencesBody>;

export interface SessionOrganization {
  id: string;
  name: string;
  kind: 'farm' | 'apiary';
  timeZone: string;
}

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: 'owner' | 'manager' | 'applicator' | 'crew' | 'viewer' | 'admin';
  units: 'imperial' | 'metric';
  timeZone: string | null;
  organization: SessionOrganization | null;
}

/** A token from an e-mailed link (invitation or password reset). */
export const emailedTokenSchema = z.string().trim().min(20, 'is missing or incomplete; open the link from the e-mail again').max(200, 'is not a valid link token');

export const passwordResetRequestBody = z.object({ email: emailSchema });
export type PasswordResetRequestBody = z.infer<typeof passwordResetRequestBody>;

export const passwordResetConfirmBody = z.object({ token: emailedTokenSchema, password: passwordSchema });
export type PasswordResetConfirmBody = z.infer<typeof passwordResetConfirmBody>;

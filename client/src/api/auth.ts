// Account calls: sign-in, sign-up, sign-out, the current user, preferences, password reset.
import { http } from './http';
import type { LoginBody, SignupBody, PreferencesBody, SessionUser, PasswordResetRequestBody, PasswordResetConfirmBody } from '@shared/schemas/auth';

export const authApi = {
  /** The CSRF token, and whether this browser has a signed-in session (so /me is only asked when it can succeed). */
  csrf: () => http.get<{ csrfToken: string; signedIn: boolean }>('/auth/csrf'),
  me: () => http.get<{ user: SessionUser }>('/auth/me', { quiet401: true }),
  login: (body: LoginBody) => http.post<{ user: SessionUser }>('/auth/login', body, { quiet401: true }),
  signup: (body: SignupBody) => http.post<{ user: SessionUser }>('/auth/signup', body),
  logout: () => http.post<{ ok: true }>('/auth/logout'),
  updatePreferences: (body: PreferencesBody) => http.patch<{ user: SessionUser }>('/auth/me/preferences', body),
  requestPasswordReset: (body: PasswordResetRequestBody) => http.post<{ ok: true }>('/auth/password-reset', body),
  confirmPasswordReset: (body: PasswordResetConfirmBody) => http.post<{ ok: true }>('/auth/password-reset/confirm', body),
};

/**
 * Sign-in and account routes.
 *
 * CSRF: every response carries a readable cookie `sagline_csrf`; every
 * POST/PUT/PATCH/DELETE must echo it in the `X-CSRF-Token` header, or it gets
 * 403 CSRF_INVALID. Session cookie `sagline_sid` is httpOnly, SameSite=Lax.
 *
 * POST /api/auth/sign-in   SignInRequest      -> 200 MeResponse | 401 BAD_CREDENTIALS | 429 RATE_LIMITED
 * POST /api/auth/sign-out                     -> 204
 * GET  /api/auth/me                           -> 200 MeResponse | 401 UNAUTHENTICATED
 * POST /api/auth/password  ChangePasswordRequest -> 204 | 400
 * GET  /api/invitations/:token                -> 200 InvitationResponse | 404 INVITATION_INVALID | 410 INVITATION_EXPIRED / INVITATION_USED
 * POST /api/invitations/:token/accept AcceptInvitationRequest -> 204 (then sign in) | 404 | 410
 */
export const CSRF_COOKIE = 'sagline_csrf';
export const CSRF_HEADER = 'x-csrf-token';
export const SESSION_COOKIE = 'sagline_sid';

export interface SignInRequest {
  email: string;
  password: string;
}

export interface Me {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

export interface MeResponse {
  user: Me;
}

export interface ChangePasswordRequest {
  currentPassword: string;
  newPassword: string;
}

export interface InvitationResponse {
  email: string;
  name: string | null;
  projectId: number | null;
  projectName: string | null;
  role: import('./constraints').ProjectRole | null;
  expiresAt: string;
}

export interface AcceptInvitationRequest {
  name: string;
  password: string;
}

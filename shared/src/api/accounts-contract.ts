// Shapes of the sign-in, session and account endpoints (/api/auth, /api/company, /api/me).

/** Every role, in the order forms list them; the type, the server's zod enum and the dashboard read this one list. */
export const ROLES = ['owner', 'installer', 'support', 'admin'] as const;

/** A role a person holds; one person may hold several. */
export type Role = (typeof ROLES)[number];

/** Roles a company gives; `owner` belongs to a person (their own systems), not to a company. */
export const COMPANY_ROLES: readonly Role[] = ['installer', 'support', 'admin'];

/** What the API tells a client about a signed-in person. */
export interface PublicUser {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
  companyId: string | null;
}

/**
 * POST /api/auth/sign-in, POST /api/auth/refresh and POST /api/auth/invitations/accept answer this; the
 * rotating refresh token travels only in the httpOnly cookie `cw_refresh` (path /api/auth).
 */
export interface SessionResponse {
  accessToken: string;
  /** Seconds until the access token expires. */
  expiresIn: number;
  user: PublicUser;
}

/** POST /api/auth/sign-in body. */
export interface SignInRequest {
  email: string;
  password: string;
}

/** POST /api/auth/password-reset/request body; always answers 202, whether or not the address is known. */
export interface PasswordResetRequest {
  email: string;
}

/** POST /api/auth/password-reset/complete body; answers 204. */
export interface PasswordResetCompletion {
  token: string;
  password: string;
}

/** POST /api/auth/invitations/accept body; answers SessionResponse. */
export interface InvitationAcceptance {
  token: string;
  displayName: string;
  password: string;
}

/** GET /api/auth/invitations/:token answers what the invitation is for, before the person accepts. */
export interface InvitationPreview {
  email: string;
  roles: Role[];
  companyName: string | null;
  expiresAt: number;
}

/** POST /api/company/invitations body (admin only); answers 201 with the Invitation. */
export interface InvitationRequest {
  email: string;
  roles: Role[];
}

/** An invitation as an admin sees it in GET /api/company/invitations. */
export interface Invitation {
  id: string;
  email: string;
  roles: Role[];
  expiresAt: number;
  acceptedAt: number | null;
}

/** GET /api/company/members (admin only). */
export interface CompanyMember {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
}

/** GET /api/companies: companies an owner may grant access to. */
export interface CompanyListing {
  id: string;
  name: string;
}

/** Minimum password length, checked on every form and route that sets a password. */
export const MIN_PASSWORD_LENGTH = 10;
/** Longest password, in UTF-8 bytes: all that bcrypt reads, so none of a longer one is silently ignored. */
export const MAX_PASSWORD_BYTES = 72;

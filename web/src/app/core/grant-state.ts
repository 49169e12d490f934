import type { Grant } from '@cellwarden/shared';

/** Where a grant stands now. */
export type GrantState = 'active' | 'expired' | 'revoked';

/** Revoked wins over expired: a revoked grant stays revoked even after its expiry passes. */
export function grantState(grant: Pick<Grant, 'revokedAt' | 'expiresAt'>, now: number): GrantState {
  if (grant.revokedAt !== null) return 'revoked';
  return grant.expiresAt <= now ? 'expired' : 'active';
}

/** Who a grant is for, in words. */
export function granteeName(grant: Pick<Grant, 'granteeCompany' | 'granteeUser'>): string {
  if (grant.granteeCompany) return grant.granteeCompany.name;
  if (grant.granteeUser)
    return grant.granteeUser.displayName === grant.granteeUser.email
      ? grant.granteeUser.email
      : `${grant.granteeUser.displayName} (${grant.granteeUser.email})`;
  return 'Unknown grantee';
}

import type { PublicUser, SystemAction } from '@cellwarden/shared';

// The one object-level access rule of Cellwarden. Every route, every stream subscription and every export asks
// `decideAccess`; nothing else compares owner ids or company ids. (OWASP API Security Top 10 2023, API1: Broken
// Object Level Authorization, is why this lives in one place.)

/** What one may do to one system: the list lives in shared/ so the dashboard names the same actions. */
export type { SystemAction };

/** The facts about a system the rule needs. */
export interface SystemOwnership {
  ownerId: string;
  installerCompanyId: string | null;
}

/** One grant as the rule sees it. */
export interface GrantFacts {
  access: 'view' | 'configure';
  granteeUserId: string | null;
  granteeCompanyId: string | null;
  expiresAt: number;
  revokedAt: number | null;
}

/** The rule's answer: which actions are allowed, and until when the answer holds (a grant's expiry). */
export interface AccessDecision {
  allowed: ReadonlySet<SystemAction>;
  validUntil: number;
}

const OWNER_ACTIONS: SystemAction[] = [
  'view',
  'export',
  'configure',
  'manage-devices',
  'manage-grants',
  'read-audit',
  'commission',
];
const FITTER_ACTIONS: SystemAction[] = ['view', 'export', 'configure', 'manage-devices', 'commission'];
const COMPANY_ADMIN_ACTIONS: SystemAction[] = ['view', 'export', 'read-audit'];
const GRANT_ACTIONS: Record<GrantFacts['access'], SystemAction[]> = {
  view: ['view', 'export'],
  configure: ['view', 'export', 'configure'],
};

/** Whether a grant names this person, directly or through their company, and still holds at `now`. */
export function grantApplies(grant: GrantFacts, user: PublicUser, now: number): boolean {
  if (grant.revokedAt !== null || grant.expiresAt <= now) return false;
  if (grant.granteeUserId) return grant.granteeUserId === user.id;
  return !!user.companyId && grant.granteeCompanyId === user.companyId;
}

/**
 * Decides what a person may do with a system: its owner everything; the installer company's installers
 * run and configure it; the company's admins read it and its audit; anyone else only what an active grant
 * gives them. Support staff therefore see nothing without an owner's grant.
 */
export function decideAccess(
  user: PublicUser,
  system: SystemOwnership,
  grants: readonly GrantFacts[],
  now: number,
): AccessDecision {
  const allowed = new Set<SystemAction>();
  let validUntil = Number.POSITIVE_INFINITY;
  if (system.ownerId === user.id) OWNER_ACTIONS.forEach((a) => allowed.add(a));
  const ofInstallerCompany = !!user.companyId && system.installerCompanyId === user.companyId;
  if (ofInstallerCompany && user.roles.includes('installer')) FITTER_ACTIONS.forEach((a) => allowed.add(a));
  if (ofInstallerCompany && user.roles.includes('admin'))
    COMPANY_ADMIN_ACTIONS.forEach((a) => allowed.add(a));
  const active = grants.filter((grant) => grantApplies(grant, user, now));
  const fromGrants = new Set(active.flatMap((grant) => GRANT_ACTIONS[grant.access]));
  // Rights that rest only on grants last as long as the longest-lived of them.
  if ([...fromGrants].some((action) => !allowed.has(action)))
    validUntil = Math.max(...active.map((g) => g.expiresAt));
  fromGrants.forEach((action) => allowed.add(action));
  return { allowed, validUntil };
}

import type { Role } from '@cellwarden/shared';

const LABELS: Record<Role, string> = {
  owner: 'System owner',
  installer: 'Installer',
  support: 'Support',
  admin: 'Company admin',
};

/** The plain-language name of a role. */
export function roleLabel(role: Role): string {
  return LABELS[role];
}

/** The roles a company admin gives when inviting: `owner` belongs to a person's own systems, not a company. */
export const COMPANY_ROLES: readonly Role[] = ['installer', 'support', 'admin'];

const REACH: Record<Role, string> = {
  owner: 'Sees and manages their own systems, and decides who else may see them.',
  installer:
    'Sees, configures and commissions every system the company installs, and manages their monitors.',
  support:
    "Sees only the systems an owner has shared with the company or with them, until the owner's grant ends.",
  admin: "Manages the team; reads the company's systems and their audit, but changes no settings.",
};

/** One line on what a person with `role` may see and do. */
export function roleReach(role: Role): string {
  return REACH[role];
}

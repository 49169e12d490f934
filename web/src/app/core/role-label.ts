// The plain-language names of the roles, used by the team screen and the invitation page alike; the role list
// itself (ROLES, COMPANY_ROLES) is shared/src/api/accounts-contract.ts.
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

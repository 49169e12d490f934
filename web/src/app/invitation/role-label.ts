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

/** Every role, in the order forms offer them. */
export const ALL_ROLES: readonly Role[] = ['owner', 'installer', 'support', 'admin'];

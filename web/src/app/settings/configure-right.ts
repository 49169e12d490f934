import type { Grant } from '@cellwarden/shared';

/** Whether the person may change a system's settings, and if not, why, in words for the form. */
export interface ConfigureRight {
  canConfigure: boolean;
  reason: string | null;
}

/** What asking for the system's grants told: only its owner may list them. */
export type OwnerAnswer = 'owner' | 'not-owner' | 'unknown';

const MAY_CONFIGURE: ConfigureRight = { canConfigure: true, reason: null };

/** Said when the server refused a change the form did not know to be refused. */
export const REFUSED_REASON =
  'You can see these settings but not change them: changing them needs the owner, a grant with the right ' +
  'to configure, or the installer of this system. Ask the owner if you need to adjust something.';

/**
 * The access rule (server/src/access/access-policy.ts) as far as the dashboard can see it: the owner may
 * configure, and so may anyone with an active grant to configure. Installers may when the system is their
 * company's, which the dashboard cannot see, so their form stays open and the server decides. Everyone else
 * (support staff, company admins, owners of other systems) sees the settings through a grant to view, or as
 * a company admin, and cannot change them. With any answer missing the form stays open.
 */
export function configureRight(
  owner: OwnerAnswer,
  roles: readonly string[] | null,
  received: readonly Grant[] | null,
  systemId: string,
  describeUntil: (ms: number) => string,
): ConfigureRight {
  if (owner !== 'not-owner' || roles === null || received === null) return MAY_CONFIGURE;
  const grants = received.filter((g) => g.systemId === systemId && g.active);
  if (grants.some((g) => g.access === 'configure')) return MAY_CONFIGURE;
  if (roles.includes('installer')) return MAY_CONFIGURE;
  const view = [...grants].sort((a, b) => b.expiresAt - a.expiresAt)[0];
  if (!view) return { canConfigure: false, reason: REFUSED_REASON };
  return {
    canConfigure: false,
    reason:
      `You have view access to this system, granted by ${view.grantedBy.displayName} until ` +
      `${describeUntil(view.expiresAt)}: you can read these settings but not change them. ` +
      'Ask the owner for configure access if something needs adjusting.',
  };
}

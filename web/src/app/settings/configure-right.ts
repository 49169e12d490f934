import type { Grant } from '@cellwarden/shared';

/** Whether the person may change a system's settings, and if not, why, in words for the form. */
export interface ConfigureRight {
  canConfigure: boolean;
  reason: string | null;
}

/** What asking for the system's devices told: owners and the installer's fitters may manage them. */
export type DeviceRight = 'allowed' | 'refused' | 'unknown';

const MAY_CONFIGURE: ConfigureRight = { canConfigure: true, reason: null };

/** Said when the server refused a change the form did not know to be refused. */
export const REFUSED_REASON =
  'You can see these settings but not change them: changing them needs the owner, a grant with the right ' +
  'to configure, or the installer of this system. Ask the owner if you need to adjust something.';

/**
 * The access rule (server/src/access/access-policy.ts) as far as the dashboard can see it: owners and the
 * installing company's fitters may manage devices and therefore configure; anyone else only through an
 * active grant to configure. When either answer is missing the form stays open and the server decides.
 */
export function configureRight(
  devices: DeviceRight,
  received: readonly Grant[] | null,
  systemId: string,
  describeUntil: (ms: number) => string,
): ConfigureRight {
  if (devices !== 'refused' || received === null) return MAY_CONFIGURE;
  const grants = received.filter((g) => g.systemId === systemId && g.active);
  if (grants.some((g) => g.access === 'configure')) return MAY_CONFIGURE;
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

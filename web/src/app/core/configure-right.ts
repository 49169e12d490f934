import { HttpErrorResponse } from '@angular/common/http';
import type { Grant } from '@cellwarden/shared';
import { Observable, catchError, forkJoin, map, of } from 'rxjs';
import type { AccessApi } from '../access/access-api';

/** Whether the person may change a system (settings, acknowledgements), and the view grant they hold if not. */
export interface ConfigureRight {
  canConfigure: boolean;
  /** The grant their view rests on, to name in the reason; null when there is none to name. */
  viewGrant: { grantedBy: string; expiresAt: number } | null;
}

/** What asking for the system's grants told: only its owner may list them. */
export type OwnerAnswer = 'owner' | 'not-owner' | 'unknown';

const MAY_CONFIGURE: ConfigureRight = { canConfigure: true, viewGrant: null };

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
): ConfigureRight {
  if (owner !== 'not-owner' || roles === null || received === null) return MAY_CONFIGURE;
  const grants = received.filter((g) => g.systemId === systemId && g.active);
  if (grants.some((g) => g.access === 'configure')) return MAY_CONFIGURE;
  if (roles.includes('installer')) return MAY_CONFIGURE;
  const view = [...grants].sort((a, b) => b.expiresAt - a.expiresAt)[0];
  return {
    canConfigure: false,
    viewGrant: view ? { grantedBy: view.grantedBy.displayName, expiresAt: view.expiresAt } : null,
  };
}

/**
 * Why someone may look but not act, for a screen to show before they try: `limits` says what they can and
 * cannot do there ("you can read these settings but not change them").
 */
export function readOnlyReason(right: ConfigureRight, limits: string, until: (ms: number) => string): string {
  const grant = right.viewGrant;
  if (!grant) {
    return (
      `${capitalised(limits)}: that needs the owner, a grant with the right to configure, or the installer ` +
      'of this system. Ask the owner if something needs doing.'
    );
  }
  return (
    `You have view access to this system, granted by ${grant.grantedBy} until ${until(grant.expiresAt)}: ` +
    `${limits}. Ask the owner for configure access if something needs doing.`
  );
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** What the dashboard can learn of the person's rights on a system before they try to change anything. */
export function rightsLoad(
  api: AccessApi,
  systemId: string,
): Observable<{ owner: OwnerAnswer; received: Grant[] | null }> {
  // Only the owner may list a system's grants (403 for anyone else who may see it).
  const owner = api.grants(systemId).pipe(
    map((): OwnerAnswer => 'owner'),
    catchError((error: unknown) =>
      of<OwnerAnswer>(error instanceof HttpErrorResponse && error.status === 403 ? 'not-owner' : 'unknown'),
    ),
  );
  const received = api.receivedGrants().pipe(catchError(() => of(null)));
  return forkJoin({ owner, received });
}

import type { Grant, SystemAction } from '@cellwarden/shared';
import { Observable, catchError, forkJoin, map, of } from 'rxjs';
import type { AccessApi } from './access-api';
import type { Api } from './api';

/** Whether the person may change a system (settings, acknowledgements), and the view grant they hold if not. */
export interface ConfigureRight {
  canConfigure: boolean;
  /** The grant their view rests on, to name in the reason; null when there is none to name. */
  viewGrant: { grantedBy: string; expiresAt: number } | null;
}

const MAY_CONFIGURE: ConfigureRight = { canConfigure: true, viewGrant: null };

/**
 * What the access rule (server/src/access/access-policy.ts) lets this person do, as the server reported it with
 * the system (`allowedActions`), so a form shows read-only before anyone tries. The view grant the person holds
 * is named in the reason when there is one. With the answer missing the form stays open and the server decides.
 */
export function configureRight(
  allowed: readonly SystemAction[] | null,
  received: readonly Grant[] | null,
  systemId: string,
): ConfigureRight {
  if (allowed === null || allowed.includes('configure')) return MAY_CONFIGURE;
  const grants = (received ?? []).filter((g) => g.systemId === systemId && g.active);
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

/** The person's actions on a system as the server decides them, and the grants they received (to name one). */
export function rightsLoad(
  api: Api,
  accessApi: AccessApi,
  systemId: string,
): Observable<{ allowed: SystemAction[] | null; received: Grant[] | null }> {
  const allowed = api.system(systemId).pipe(
    map((system) => system.allowedActions ?? null),
    catchError(() => of(null)),
  );
  const received = accessApi.receivedGrants().pipe(catchError(() => of(null)));
  return forkJoin({ allowed, received });
}

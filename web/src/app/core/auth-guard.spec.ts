import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import type { Observable } from 'rxjs';
import { authGuard } from './auth-guard';
import { roleGuard } from './role-guard';

const session = (roles: string[]) => ({
  accessToken: 'tok-1',
  expiresIn: 900,
  user: { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles, companyId: null },
});

describe('authGuard and roleGuard', () => {
  let router: Router;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    router = TestBed.inject(Router);
    http = TestBed.inject(HttpTestingController);
  });

  /** Runs the route's guard for `url`, answering the session-restoring refresh with `refresh`. */
  function go(url: string, refresh: object | null): string {
    const guard = url.startsWith('/installer') ? roleGuard(['installer', 'admin']) : authGuard;
    let verdict: unknown;
    const state = { url } as RouterStateSnapshot;
    TestBed.runInInjectionContext(() =>
      (guard({} as ActivatedRouteSnapshot, state) as Observable<unknown>).subscribe((v) => (verdict = v)),
    );
    const request = http.expectOne('/api/auth/refresh');
    if (refresh) request.flush(refresh);
    else request.flush({}, { status: 401, statusText: 'Unauthorized' });
    return verdict instanceof UrlTree ? router.serializeUrl(verdict) : String(verdict);
  }

  it('sends a visitor without a session to sign-in with the return URL', () => {
    expect(go('/systems/s1/access', null)).toBe('/sign-in?returnUrl=%2Fsystems%2Fs1%2Faccess');
  });

  it('lets a visitor in once the refresh cookie restores the session', () => {
    expect(go('/systems/s1/access', session(['owner']))).toBe('true');
  });

  it('lets an installer open the installer tools', () => {
    expect(go('/installer', session(['installer']))).toBe('true');
  });

  it('turns an owner away from the installer tools to the systems list', () => {
    expect(go('/installer', session(['owner']))).toBe('/systems');
  });

  it('sends a visitor without a session from a role-guarded page to sign-in', () => {
    expect(go('/installer', null)).toBe('/sign-in?returnUrl=%2Finstaller');
  });
});

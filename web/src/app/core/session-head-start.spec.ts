import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { firstValueFrom, type Observable } from 'rxjs';
import { Auth } from './auth';
import { authGuard } from './auth-guard';
import {
  SESSION_HEAD_START,
  takeSessionHeadStart,
  takeStatusHeadStart,
  takeSystemHeadStart,
  type SessionHeadStartAnswer,
} from './session-head-start';

const USER = { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'], companyId: null };
const SESSION = { accessToken: 'tok-early', expiresIn: 900, user: USER };

describe('the session renewal started before the app', () => {
  let http: HttpTestingController;
  let answer: (value: SessionHeadStartAnswer) => void;

  beforeEach(() => {
    const started = new Promise<SessionHeadStartAnswer>((resolve) => (answer = resolve));
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: SESSION_HEAD_START, useValue: started },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });

  afterEach(() => http.verify());

  it('is taken over by Auth instead of a renewal of its own', async () => {
    const auth = TestBed.inject(Auth);
    const restored = firstValueFrom(auth.restoreSession());
    http.expectNone('/api/auth/refresh');
    answer({ status: 200, body: SESSION });
    expect(await restored).toBe(true);
    expect(auth.accessToken()).toBe('tok-early');
    expect(auth.currentUser()?.displayName).toBe('Ana');
  });

  it('is shared by every caller while it is on its way, and the next renewal asks the server itself', async () => {
    const auth = TestBed.inject(Auth);
    const fromGuard = firstValueFrom(auth.restoreSession());
    const fromInterceptor = firstValueFrom(auth.refresh());
    http.expectNone('/api/auth/refresh');
    answer({ status: 200, body: SESSION });
    expect(await fromGuard).toBe(true);
    expect(await fromInterceptor).toBe('tok-early');

    const later = firstValueFrom(auth.refresh());
    http.expectOne('/api/auth/refresh').flush({ ...SESSION, accessToken: 'tok-later' });
    expect(await later).toBe('tok-later');
  });

  it('sends the visitor to sign-in when the server refuses it', async () => {
    const verdict = TestBed.runInInjectionContext(() =>
      firstValueFrom(
        authGuard({} as ActivatedRouteSnapshot, { url: '/systems/s1' } as RouterStateSnapshot) as Observable<
          boolean | UrlTree
        >,
      ),
    );
    answer({ status: 401, body: null });
    const result = await verdict;
    expect(result instanceof UrlTree && TestBed.inject(Router).serializeUrl(result)).toBe(
      '/sign-in?returnUrl=%2Fsystems%2Fs1',
    );
    expect(TestBed.inject(Auth).isSignedIn()).toBe(false);
  });

  it('leaves a held session alone when it failed only for want of a connection', async () => {
    const auth = TestBed.inject(Auth);
    auth.signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ ...SESSION, accessToken: 'tok-1' });
    const renewed = firstValueFrom(auth.refresh());
    answer({ status: 0, body: null });
    expect(await renewed).toBeNull();
    expect(auth.accessToken()).toBe('tok-1');
  });
});

describe('takeSessionHeadStart', () => {
  afterEach(() => delete (globalThis as { cwSessionHeadStart?: unknown }).cwSessionHeadStart);

  it('hands the page-started renewal out once only', () => {
    const started = Promise.resolve({ status: 200, body: SESSION });
    (globalThis as { cwSessionHeadStart?: unknown }).cwSessionHeadStart = started;
    expect(takeSessionHeadStart()).toBe(started);
    expect(takeSessionHeadStart()).toBeNull();
  });

  it('is null when the page started none (a public page, or tests)', () => {
    expect(takeSessionHeadStart()).toBeNull();
  });
});

describe('takeStatusHeadStart', () => {
  const holder = globalThis as { cwStatusHeadStart?: unknown };
  afterEach(() => delete holder.cwStatusHeadStart);

  it("hands out the page's status request for its own system, once", () => {
    const answer = Promise.resolve({ status: 200, body: null });
    holder.cwStatusHeadStart = { systemId: 'van-1', answer };
    expect(takeStatusHeadStart('van-1')).toBe(answer);
    expect(takeStatusHeadStart('van-1')).toBeNull();
  });

  it('gives nothing for another system (the visitor moved on before the view started)', () => {
    holder.cwStatusHeadStart = { systemId: 'van-1', answer: Promise.resolve({ status: 200, body: null }) };
    expect(takeStatusHeadStart('van-2')).toBeNull();
  });
});

describe('takeSystemHeadStart', () => {
  const holder = globalThis as { cwSystemHeadStart?: unknown; cwStatusHeadStart?: unknown };
  afterEach(() => {
    delete holder.cwSystemHeadStart;
    delete holder.cwStatusHeadStart;
  });

  it("hands out the page's request for its own system's description, once, apart from the status", () => {
    const answer = Promise.resolve({ status: 200, body: null });
    const status = Promise.resolve({ status: 200, body: null });
    holder.cwSystemHeadStart = { systemId: 'van-1', answer };
    holder.cwStatusHeadStart = { systemId: 'van-1', answer: status };
    expect(takeSystemHeadStart('van-1')).toBe(answer);
    expect(takeSystemHeadStart('van-1')).toBeNull();
    expect(takeStatusHeadStart('van-1')).toBe(status);
  });

  it('gives nothing for another system', () => {
    holder.cwSystemHeadStart = { systemId: 'van-1', answer: Promise.resolve({ status: 200, body: null }) };
    expect(takeSystemHeadStart('van-2')).toBeNull();
  });
});

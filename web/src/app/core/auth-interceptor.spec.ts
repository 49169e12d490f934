import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { authInterceptor } from './auth-interceptor';
import { Auth } from './auth';

const USER = { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'], companyId: null };
const UNAUTHORIZED = { status: 401, statusText: 'Unauthorized' };
const REFUSAL = { error: { code: 'unauthorized', message: 'Token expired.' } };

describe('authInterceptor', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });

  function signIn(token = 'tok-1') {
    TestBed.inject(Auth).signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ accessToken: token, expiresIn: 900, user: USER });
  }

  function getSystems(results: unknown[], errors: unknown[] = []) {
    TestBed.inject(HttpClient)
      .get('/api/systems')
      .subscribe({ next: (body) => results.push(body), error: (error) => errors.push(error) });
  }

  it('adds the bearer token to API requests', () => {
    signIn();
    getSystems([]);
    expect(http.expectOne('/api/systems').request.headers.get('Authorization')).toBe('Bearer tok-1');
  });

  it('leaves requests outside /api alone', () => {
    signIn();
    TestBed.inject(HttpClient).get('/assets/x.json').subscribe();
    expect(http.expectOne('/assets/x.json').request.headers.has('Authorization')).toBe(false);
  });

  it('refreshes once on a 401 and retries the request with the new token', () => {
    signIn();
    const results: unknown[] = [];
    getSystems(results);
    http.expectOne('/api/systems').flush(REFUSAL, UNAUTHORIZED);
    http.expectOne('/api/auth/refresh').flush({ accessToken: 'tok-2', expiresIn: 900, user: USER });
    const retry = http.expectOne('/api/systems');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer tok-2');
    retry.flush({ systems: [] });
    expect(results).toEqual([{ systems: [] }]);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('shares one refresh between parallel requests that get a 401', () => {
    signIn();
    getSystems([]);
    TestBed.inject(HttpClient).get('/api/grants/received').subscribe();
    http.expectOne('/api/systems').flush(REFUSAL, UNAUTHORIZED);
    http.expectOne('/api/grants/received').flush(REFUSAL, UNAUTHORIZED);
    http.expectOne('/api/auth/refresh').flush({ accessToken: 'tok-2', expiresIn: 900, user: USER });
    expect(http.expectOne('/api/systems').request.headers.get('Authorization')).toBe('Bearer tok-2');
    expect(http.expectOne('/api/grants/received').request.headers.get('Authorization')).toBe('Bearer tok-2');
    http.expectNone('/api/auth/refresh');
  });

  it('signs out and goes to sign-in with a return URL when the retry gets a second 401', () => {
    signIn();
    const errors: unknown[] = [];
    getSystems([], errors);
    http.expectOne('/api/systems').flush(REFUSAL, UNAUTHORIZED);
    http.expectOne('/api/auth/refresh').flush({ accessToken: 'tok-2', expiresIn: 900, user: USER });
    http.expectOne('/api/systems').flush(REFUSAL, UNAUTHORIZED);
    http.expectNone('/api/auth/refresh');
    expect(errors).toHaveLength(1);
    expect(TestBed.inject(Auth).isSignedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], expect.anything());
  });

  it('signs out when the refresh itself is refused, without retrying', () => {
    signIn();
    const errors: unknown[] = [];
    getSystems([], errors);
    http.expectOne('/api/systems').flush(REFUSAL, UNAUTHORIZED);
    http.expectOne('/api/auth/refresh').flush(REFUSAL, UNAUTHORIZED);
    http.expectNone('/api/systems');
    expect(errors).toHaveLength(1);
    expect(TestBed.inject(Auth).isSignedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], expect.anything());
  });

  it('does not refresh when an /api/auth/ call answers 401', () => {
    const errors: unknown[] = [];
    TestBed.inject(Auth)
      .signIn('ana@example.com', 'wrong')
      .subscribe({ error: (error) => errors.push(error) });
    http.expectOne('/api/auth/sign-in').flush(REFUSAL, UNAUTHORIZED);
    http.expectNone('/api/auth/refresh');
    expect(errors).toHaveLength(1);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('passes other errors through untouched', () => {
    signIn();
    const errors: unknown[] = [];
    getSystems([], errors);
    http.expectOne('/api/systems').flush(REFUSAL, { status: 500, statusText: 'Server Error' });
    http.expectNone('/api/auth/refresh');
    expect(errors).toHaveLength(1);
    expect(TestBed.inject(Auth).isSignedIn()).toBe(true);
  });
});

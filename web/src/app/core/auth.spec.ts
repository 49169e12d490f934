import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { Auth } from './auth';

const USER = {
  id: 'u1',
  email: 'ana@example.com',
  displayName: 'Ana',
  roles: ['installer'],
  companyId: 'c1',
};

describe('Auth', () => {
  let http: HttpTestingController;
  let auth: Auth;

  beforeEach(() => {
    sessionStorage.clear();
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    auth = TestBed.inject(Auth);
    jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });

  it('keeps the access token in memory only, never in web storage', () => {
    auth.signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
    expect(auth.accessToken()).toBe('tok-1');
    expect(JSON.stringify({ ...sessionStorage, ...localStorage })).not.toContain('tok-1');
  });

  it('restores a session on start from the refresh cookie', () => {
    const answers: boolean[] = [];
    auth.restoreSession().subscribe((ok) => answers.push(ok));
    const request = http.expectOne('/api/auth/refresh');
    expect(request.request.method).toBe('POST');
    request.flush({ accessToken: 'tok-9', expiresIn: 900, user: USER });
    expect(answers).toEqual([true]);
    expect(auth.currentUser()?.displayName).toBe('Ana');
  });

  it('tries the refresh cookie only once per page load when there is no session', () => {
    const answers: boolean[] = [];
    auth.restoreSession().subscribe((ok) => answers.push(ok));
    http.expectOne('/api/auth/refresh').flush({}, { status: 401, statusText: 'Unauthorized' });
    auth.restoreSession().subscribe((ok) => answers.push(ok));
    http.expectNone('/api/auth/refresh');
    expect(answers).toEqual([false, false]);
  });

  it('tells the server on sign-out, then forgets the session', () => {
    auth.signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
    auth.signOut();
    const request = http.expectOne('/api/auth/sign-out');
    expect(request.request.method).toBe('POST');
    expect(auth.isSignedIn()).toBe(true);
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(auth.isSignedIn()).toBe(false);
  });

  it('knows which roles the user holds', () => {
    auth.signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
    expect(auth.hasAnyRole(['installer', 'admin'])).toBe(true);
    expect(auth.hasAnyRole(['admin'])).toBe(false);
  });

  it('renews the access token a minute before it expires', () => {
    jest.useFakeTimers();
    try {
      auth.signIn('ana@example.com', 'secret').subscribe();
      http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
      jest.advanceTimersByTime(839_999);
      http.expectNone('/api/auth/refresh');
      jest.advanceTimersByTime(1);
      http.expectOne('/api/auth/refresh').flush({ accessToken: 'tok-2', expiresIn: 900, user: USER });
      expect(auth.accessToken()).toBe('tok-2');
    } finally {
      jest.useRealTimers();
    }
  });

  it('stops renewing once the session ends', () => {
    jest.useFakeTimers();
    try {
      auth.signIn('ana@example.com', 'secret').subscribe();
      http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
      auth.endSession();
      jest.advanceTimersByTime(900_000);
      http.expectNone('/api/auth/refresh');
    } finally {
      jest.useRealTimers();
    }
  });

  it('keeps the session when a renewal fails only for want of a connection', () => {
    auth.signIn('ana@example.com', 'secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok-1', expiresIn: 900, user: USER });
    const answers: (string | null)[] = [];
    auth.refresh().subscribe((token) => answers.push(token));
    http.expectOne('/api/auth/refresh').error(new ProgressEvent('error'), { status: 0 });
    expect(answers).toEqual([null]);
    expect(auth.isSignedIn()).toBe(true);
  });
});

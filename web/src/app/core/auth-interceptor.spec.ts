import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { authInterceptor } from './auth-interceptor';
import { Auth } from './auth';

describe('authInterceptor', () => {
  beforeEach(() => {
    sessionStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
      ],
    });
  });

  function signIn() {
    TestBed.inject(Auth).signIn('ana@example.com', 'secret').subscribe();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/auth/sign-in')
      .flush({
        accessToken: 'tok-1',
        expiresIn: 900,
        user: { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'] },
      });
  }

  it('adds the bearer token to API requests', () => {
    signIn();
    TestBed.inject(HttpClient).get('/api/systems').subscribe();
    const request = TestBed.inject(HttpTestingController).expectOne('/api/systems');
    expect(request.request.headers.get('Authorization')).toBe('Bearer tok-1');
  });

  it('leaves requests outside /api alone', () => {
    signIn();
    TestBed.inject(HttpClient).get('/assets/x.json').subscribe();
    const request = TestBed.inject(HttpTestingController).expectOne('/assets/x.json');
    expect(request.request.headers.has('Authorization')).toBe(false);
  });

  it('sends the user to /sign-in when the server answers 401', () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    TestBed.inject(HttpClient)
      .get('/api/systems')
      .subscribe({ error: () => undefined });
    TestBed.inject(HttpTestingController)
      .expectOne('/api/systems')
      .flush({ error: { code: 'unauthorized', message: 'no' } }, { status: 401, statusText: 'Unauthorized' });
    expect(navigate).toHaveBeenCalledWith(['/sign-in']);
  });
});

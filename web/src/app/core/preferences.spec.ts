import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Auth } from './auth';
import { Preferences } from './preferences';

describe('Preferences', () => {
  beforeEach(() =>
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    }),
  );

  it('loads the person’s preferences once they sign in', async () => {
    const preferences = TestBed.inject(Preferences);
    const http = TestBed.inject(HttpTestingController);
    TestBed.inject(Auth).signIn('ana@example.com', 'long-enough-secret').subscribe();
    http.expectOne('/api/auth/sign-in').flush({
      accessToken: 'tok',
      expiresIn: 900,
      user: { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'], companyId: null },
    });
    TestBed.tick();
    http
      .expectOne('/api/me/preferences')
      .flush({ preferences: { temperatureUnit: 'F', emailFlags: ['low-charge'] } });
    expect(preferences.temperatureUnit()).toBe('F');
    expect(preferences.emailFlags()).toEqual(['low-charge']);
  });

  it('keeps °C when the preferences cannot be loaded', () => {
    const preferences = TestBed.inject(Preferences);
    preferences.load().subscribe({ error: () => undefined });
    TestBed.inject(HttpTestingController)
      .expectOne('/api/me/preferences')
      .flush({ error: { code: 'boom', message: 'x' } }, { status: 500, statusText: 'Error' });
    expect(preferences.temperatureUnit()).toBe('C');
  });
});

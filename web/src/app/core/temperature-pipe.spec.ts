import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Preferences } from './preferences';
import { TemperaturePipe } from './temperature-pipe';

describe('TemperaturePipe', () => {
  beforeEach(() =>
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), TemperaturePipe],
    }),
  );

  it('shows °C until the person chooses otherwise', () =>
    expect(TestBed.inject(TemperaturePipe).transform(-2.26)).toBe('-2.3 °C'));

  it('follows the saved preference to °F', () => {
    TestBed.inject(Preferences).save({ temperatureUnit: 'F', emailFlags: [] }).subscribe();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/me/preferences')
      .flush({ preferences: { temperatureUnit: 'F', emailFlags: [] } });
    // NIST SP 811 (2008), B.9: −40 °C × 1.8 + 32 = −40 °F.
    expect(TestBed.inject(TemperaturePipe).transform(-40)).toBe('-40.0 °F');
  });
});

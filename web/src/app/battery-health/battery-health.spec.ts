import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { LOCALE_ID, NO_ERRORS_SCHEMA, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import type { BatteryHealthResponse } from '@cellwarden/shared';
import { BaseChartDirective } from 'ng2-charts';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { Preferences } from '../core/preferences';
import { BatteryHealth } from './battery-health';

const DAY = 86_400_000;
const FROM = Date.UTC(2025, 11, 1);
const TO = Date.UTC(2026, 11, 1);

function answer(overrides: Partial<BatteryHealthResponse> = {}): BatteryHealthResponse {
  return {
    systemId: 'van-1',
    systemName: 'Winter van',
    chemistry: 'lifepo4',
    nominalVoltage: 12,
    ratedCapacityAh: 200,
    usableCapacityAh: 190,
    timeZone: 'Europe/Helsinki',
    period: { from: FROM, to: TO },
    capacity: {
      months: [
        { monthStart: Date.UTC(2026, 0, 1), usableAh: 188, sigmaAh: 3, samples: 4 },
        { monthStart: Date.UTC(2026, 10, 1), usableAh: 179, sigmaAh: 3, samples: 4 },
      ],
      current: { usableAh: 179, sigmaAh: 3, stateOfHealth: 0.94, sigmaStateOfHealth: 0.016, asOf: TO - DAY },
    },
    sampleCount: 8,
    figures: {
      equivalentFullCycles: 151.2,
      ahIn: 30000,
      ahOut: 28700,
      whIn: 390000,
      whOut: 370000,
      chargeEfficiency: 0.95,
      depthOfDischarge: [{ fromPercent: 0, toPercent: 10, cycles: 30 }],
      temperatureHours: [
        { band: 'below-0', hours: 300 },
        { band: '0-10', hours: 2000 },
        { band: '10-35', hours: 6400 },
        { band: '35-45', hours: 60 },
        { band: 'above-45', hours: 0 },
      ],
      hotAtHighChargeHours: 12,
      coldCharging: [
        // 2026-01-14 20:00 UTC is 22:00 in Helsinki.
        {
          start: Date.UTC(2026, 0, 14, 20),
          end: Date.UTC(2026, 0, 15, 2),
          ahIn: 6.2,
          lowestTemperature: -4,
          highestTemperature: -1,
        },
      ],
      hotCharging: [],
      hoursCovered: 8760,
    },
    words: ['Holds about 94 % of its rated usable capacity, ± 2 %.', 'Charged twice below freezing.'],
    method: 'Coulomb counting between a full charge and a rested voltage.',
    mayExport: true,
    lateDataNote: null,
    ...overrides,
  };
}

describe('BatteryHealth', () => {
  const unit = signal<'C' | 'F'>('C');
  beforeEach(() => {
    unit.set('C');
    TestBed.configureTestingModule({
      imports: [BatteryHealth],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: LOCALE_ID, useValue: 'en-GB' },
        { provide: Preferences, useValue: { temperatureUnit: unit } },
      ],
    });
    // jsdom has no canvas; the chart data have their own spec.
    TestBed.overrideComponent(ChartFigure, {
      remove: { imports: [BaseChartDirective] },
      add: { schemas: [NO_ERRORS_SCHEMA] },
    });
  });

  function render(body: BatteryHealthResponse) {
    const fixture = TestBed.createComponent(BatteryHealth);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    const request = TestBed.inject(HttpTestingController).expectOne(
      (r) => r.url === '/api/systems/van-1/battery-health',
    );
    expect(request.request.params.get('locale')).toBe('en-GB');
    // The sentences carry temperatures: they come in the person's chosen unit.
    expect(request.request.params.get('unit')).toBe(TestBed.inject(Preferences).temperatureUnit());
    request.flush(body);
    fixture.detectChanges();
    return fixture;
  }

  it('leads with the plain words and the present estimate with its band', () => {
    const text = render(answer()).nativeElement.textContent as string;
    expect(text).toContain('Holds about 94 % of its rated usable capacity, ± 2 %.');
    expect(text).toContain('Charged twice below freezing.');
    expect(text).toMatch(/179 Ah\s*± 3 Ah/);
    expect(text).toContain('from 8 measurements');
  });

  it('lists each cold-charging episode in the system’s own clock, naming its zone', () => {
    const text = render(answer()).nativeElement.textContent as string;
    expect(text).toContain("Times in the system's time zone, Europe/Helsinki.");
    expect(text).toContain('Charged below freezing');
    expect(text).toMatch(/14 Jan 2026,? 22:00/);
    expect(text).toContain('-4.0 °C');
  });

  it('shows the episode temperatures in °F when the person prefers it', () => {
    unit.set('F');
    const text = render(answer()).nativeElement.textContent as string;
    expect(text).toContain('24.8 °F');
  });

  it('offers the PDF and CSV downloads only to someone who may export', async () => {
    const allowed = render(answer());
    const buttons = await TestbedHarnessEnvironment.loader(allowed).getAllHarnesses(MatButtonHarness);
    const labels = await Promise.all(buttons.map((b) => b.getText()));
    expect(labels.some((l) => l.includes('Download PDF'))).toBe(true);
    expect(labels.some((l) => l.includes('Download CSV'))).toBe(true);
    allowed.destroy();

    const refused = render(answer({ mayExport: false }));
    const none = await TestbedHarnessEnvironment.loader(refused).getAllHarnesses(MatButtonHarness);
    expect(none).toHaveLength(0);
  });

  it('says when there is no capacity measurement yet', () => {
    const text = render(answer({ capacity: { months: [] }, sampleCount: 0, words: [] })).nativeElement
      .textContent as string;
    expect(text).toContain('No capacity measurement yet');
    expect(text).toContain('Nothing to tell yet');
  });

  it('tells the person when the figures could not be loaded', () => {
    const fixture = TestBed.createComponent(BatteryHealth);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne((r) => r.url === '/api/systems/van-1/battery-health')
      .flush({ error: { code: 'x', message: 'x' } }, { status: 500, statusText: 'Server Error' });
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'The battery health could not be loaded',
    );
  });
});

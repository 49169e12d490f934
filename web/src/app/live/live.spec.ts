import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { LOCALE_ID, NO_ERRORS_SCHEMA } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type {
  DerivedState,
  ReceivedReading,
  SystemSettings,
  SystemStatus,
  SystemSummary,
} from '@cellwarden/shared';
import { BaseChartDirective } from 'ng2-charts';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { Subject } from 'rxjs';
import type { WebSocketSubjectConfig } from 'rxjs/webSocket';
import { flagText } from '../core/flag-text';
import { WEB_SOCKET_FACTORY } from '../core/live-stream';
import { Preferences } from '../core/preferences';
import { Live } from './live';

const NOW = Date.UTC(2026, 11, 2, 20, 0, 0);

class FakeSocket extends Subject<unknown> {
  constructor(readonly config: WebSocketSubjectConfig<unknown>) {
    super();
  }
  override next(): void {
    // Messages to the server are not under test here.
  }
  open(): void {
    this.config.openObserver?.next(new Event('open'));
  }
  receive(message: unknown): void {
    super.next(message);
  }
}

const summary: SystemSummary = {
  id: 'van-1',
  name: 'Blue van',
  kind: 'van',
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 180,
  latestReading: null,
};
const reading = (over: Partial<ReceivedReading> = {}): ReceivedReading => ({
  measuredAt: NOW - 10_000,
  receivedAt: NOW - 9_000,
  voltage: 13.21,
  current: -8.4,
  temperature: 18,
  stateOfCharge: 71,
  ...over,
});
const derived = (over: Partial<DerivedState> = {}): DerivedState => ({
  stateOfCharge: 71,
  stateOfChargeSource: 'reported',
  hoursToEmpty: 15.5,
  hoursToFull: null,
  meanCurrent: -8,
  byMorning: { at: NOW + 11 * 3_600_000, stateOfCharge: 42, crossesLowAt: null },
  activeFlags: [],
  ...over,
});

const settingsIn = (timeZone: string): SystemSettings => ({
  name: 'Blue van',
  kind: 'van',
  timeZone,
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 160 },
  bms: { continuousDischargeA: 150, lowVoltageCutoffV: null },
  chargeSources: [],
  thresholds: {
    lowChargeWarningPercent: 20,
    lowChargeCriticalPercent: 10,
    lowVoltageV: 12,
    overTemperatureC: 45,
    silentAfterMinutes: 15,
  },
});
// The zone a spec's viewer is in, whatever the machine running it.
const viewerZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
const otherZone = ['Pacific/Auckland', 'America/Halifax'].find((z) => {
  const offset = (zone: string) =>
    new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset' }).format(NOW);
  return offset(z) !== offset(viewerZone);
})!;

describe('Live', () => {
  let sockets: FakeSocket[];

  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    sockets = [];
    TestBed.configureTestingModule({
      imports: [Live],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: LOCALE_ID, useValue: 'en-GB' },
        {
          provide: WEB_SOCKET_FACTORY,
          useValue: (config: WebSocketSubjectConfig<unknown>) => {
            const socket = new FakeSocket(config);
            sockets.push(socket);
            return socket;
          },
        },
      ],
    });
    // jsdom has no canvas; the chart's data is covered by the to-chart-series spec.
    TestBed.overrideComponent(ChartFigure, {
      remove: { imports: [BaseChartDirective] },
      add: { schemas: [NO_ERRORS_SCHEMA] },
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(status: Partial<SystemStatus> = {}, settings?: SystemSettings) {
    const fixture = TestBed.createComponent(Live);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems/van-1').flush({ system: summary });
    http.expectOne('/api/systems/van-1/status').flush({
      status: {
        systemId: 'van-1',
        latestReading: reading(),
        derived: derived(),
        activeAlerts: [],
        ...status,
      },
    });
    http
      .expectOne((r) => r.url === '/api/systems/van-1/readings')
      .flush({ resolution: 'raw', columns: { measuredAt: [] } });
    const settingsRequest = http.expectOne('/api/systems/van-1/settings');
    if (settings) settingsRequest.flush({ settings });
    else
      settingsRequest.flush(
        { error: { code: 'forbidden', message: 'no' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    const text = () => (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
    const settle = async () => {
      fixture.detectChanges();
      await fixture.whenStable();
    };
    return { fixture, text, settle };
  }

  it('shows charge, voltage, current with its direction, power, temperature and time to empty', async () => {
    const { text, fixture } = await render();
    const figure = (fixture.nativeElement as HTMLElement).querySelector('cw-charge-column svg');
    expect(figure?.getAttribute('aria-label')).toContain('State of charge 71 %');
    expect(text()).toContain('13.21 V');
    expect(text()).toContain('-8.4 A');
    expect(text()).toContain('out of the pack');
    // P = V × I: 13.21 V × −8.4 A ≈ −111 W.
    expect(text()).toContain('-111 W');
    expect(text()).toContain('18.0 °C');
    expect(text()).toContain('Time to empty');
    expect(text()).toContain('15 h 30 min');
    expect(text()).toContain('about 42 %');
  });

  it('takes new values and derived state from stream readings', async () => {
    const { text, settle } = await render();
    sockets[0].open();
    sockets[0].receive({
      type: 'reading',
      systemId: 'van-1',
      reading: reading({
        measuredAt: NOW - 1000,
        current: 12.5,
        voltage: 13.6,
        sourceCurrents: { solar: 9, dcdc: 3 },
      }),
      derived: derived({ hoursToEmpty: null, hoursToFull: 2 }),
    });
    await settle();
    expect(text()).toContain('13.60 V');
    expect(text()).toContain('into the pack');
    expect(text()).toContain('Time to full');
    expect(text()).toContain('2 h');
    // Shares: 9 A of 12 A is 75 %, 3 A of 12 A is 25 %.
    expect(text()).toContain('9.0 A · 75 %');
    expect(text()).toContain('3.0 A · 25 %');
  });

  it('marks values as not current once no reading has come for over two minutes', async () => {
    const { text } = await render({ latestReading: reading({ measuredAt: NOW - 3 * 60_000 }) });
    expect(text()).toContain('Not current');
  });

  it('shows each active flag with what it means and what to do', async () => {
    const { text } = await render({
      derived: derived({
        activeFlags: [{ kind: 'low-charge', severity: 'warning', since: NOW - 60_000, peakValue: 18 }],
      }),
    });
    expect(text()).toContain(flagText('low-charge').title);
    expect(text()).toContain(flagText('low-charge').whatToDo);
  });

  it('adds a flag when the stream announces an alert', async () => {
    const { text, settle } = await render();
    sockets[0].open();
    sockets[0].receive({
      type: 'alert',
      systemId: 'van-1',
      alert: {
        id: 'a1',
        systemId: 'van-1',
        kind: 'over-temperature',
        severity: 'critical',
        startedAt: NOW,
        endedAt: null,
        peakValue: 52,
        unit: 'Cel',
        acknowledgedAt: null,
        acknowledgedBy: null,
        note: null,
      },
    });
    await settle();
    expect(text()).toContain(flagText('over-temperature').title);
  });

  it('says access has ended and stops showing values', async () => {
    const { text, settle } = await render();
    sockets[0].open();
    sockets[0].receive({ type: 'access-ended', systemIds: ['van-1'] });
    await settle();
    expect(text()).toContain('access to this system has ended');
    expect(text()).not.toContain('13.21 V');
  });

  it('shows the pack temperature in °F when the person prefers it', async () => {
    TestBed.inject(Preferences).load().subscribe();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/me/preferences')
      .flush({ preferences: { temperatureUnit: 'F', emailFlags: [] } });
    const { text } = await render();
    // NIST SP 811 (2008), B.9: 18 °C × 1.8 + 32 = 64.4 °F.
    expect(text()).toContain('64.4 °F');
  });

  it('shows the connection state of the live stream', async () => {
    const { text, settle } = await render();
    expect(text()).toContain('Live: connecting');
    sockets[0].open();
    await settle();
    expect(text()).toContain('Live: connected');
  });

  it('answers whether the charge lasts until the system’s morning, and with what to spare', async () => {
    const { text } = await render({}, settingsIn(viewerZone));
    const seven = new Intl.DateTimeFormat('en-GB', { timeStyle: 'short', timeZone: viewerZone }).format(
      NOW + 11 * 3_600_000,
    );
    expect(text()).toContain(`Lasts until ${seven} with 42 % to spare`);
    expect(text()).not.toContain('system time');
  });

  it('says when the charge runs out if that comes before morning', async () => {
    const { text } = await render(
      {
        derived: derived({
          hoursToEmpty: 3,
          byMorning: { at: NOW + 11 * 3_600_000, stateOfCharge: 0, crossesLowAt: null },
        }),
      },
      settingsIn('UTC'),
    );
    // A reading at 19:59:50 UTC + 3 h on the system's clock, to the minute.
    expect(text()).toContain('Runs out around 23:00');
  });

  it('names the system’s zone when it differs from the viewer’s', async () => {
    const { text } = await render({}, settingsIn(otherZone));
    const zone = new Intl.DateTimeFormat('en-GB', { timeZone: otherZone, timeZoneName: 'long' })
      .formatToParts(NOW + 11 * 3_600_000)
      .find((p) => p.type === 'timeZoneName')!.value;
    expect(text()).toContain(`(system time, ${zone})`);
  });

  it('shows the amp-hours left from the usable capacity in the settings', async () => {
    const { text } = await render({}, settingsIn('UTC'));
    // 71 % of 160 Ah usable.
    expect(text()).toMatch(/Charge left\s*114 Ah/);
  });

  describe('the first glance the page painted before the app ran', () => {
    const paintFirstGlance = () => {
      const glance = document.createElement('section');
      glance.id = 'cw-first-glance';
      document.body.appendChild(glance);
    };
    afterEach(() => document.getElementById('cw-first-glance')?.remove());

    it('stands while the status is on its way and gives way once the tiles show values', async () => {
      paintFirstGlance();
      const fixture = TestBed.createComponent(Live);
      fixture.componentRef.setInput('id', 'van-1');
      fixture.detectChanges();
      await fixture.whenStable();
      expect(document.getElementById('cw-first-glance')).not.toBeNull();

      const http = TestBed.inject(HttpTestingController);
      http.expectOne('/api/systems/van-1').flush({ system: summary });
      http.expectOne('/api/systems/van-1/status').flush({
        status: { systemId: 'van-1', latestReading: reading(), derived: derived(), activeAlerts: [] },
      });
      fixture.detectChanges();
      await fixture.whenStable();
      expect((fixture.nativeElement as HTMLElement).querySelector('.tiles .tile dd')).not.toBeNull();
      expect(document.getElementById('cw-first-glance')).toBeNull();
    });

    it('gives way to the message when the system cannot be seen', async () => {
      paintFirstGlance();
      const fixture = TestBed.createComponent(Live);
      fixture.componentRef.setInput('id', 'van-1');
      fixture.detectChanges();
      TestBed.inject(HttpTestingController)
        .expectOne('/api/systems/van-1')
        .flush(
          { error: { code: 'not_found', message: 'System not found' } },
          { status: 404, statusText: 'No' },
        );
      fixture.detectChanges();
      await fixture.whenStable();
      expect(document.getElementById('cw-first-glance')).toBeNull();
    });

    it('goes with the view when the visitor leaves before the values came', async () => {
      paintFirstGlance();
      const fixture = TestBed.createComponent(Live);
      fixture.componentRef.setInput('id', 'van-1');
      fixture.detectChanges();
      fixture.destroy();
      expect(document.getElementById('cw-first-glance')).toBeNull();
    });
  });
});

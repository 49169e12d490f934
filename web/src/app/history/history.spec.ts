import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { LOCALE_ID, NO_ERRORS_SCHEMA } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import { toHistoryColumns, type AlertEvent } from '@cellwarden/shared';
import { BaseChartDirective } from 'ng2-charts';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { flagText } from '../core/flag-text';
import { History } from './history';

const NOW = Date.UTC(2026, 11, 2, 12, 0, 0);
const HOUR = 3_600_000;

const alert: AlertEvent = {
  id: 'a1',
  systemId: 'van-1',
  kind: 'cold-charging',
  severity: 'critical',
  startedAt: NOW - 5 * HOUR,
  endedAt: NOW - 4 * HOUR,
  peakValue: -3,
  unit: 'Cel',
  acknowledgedAt: null,
  acknowledgedBy: null,
  note: null,
};

describe('History', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [History],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: LOCALE_ID, useValue: 'en-GB' },
      ],
    });
    // jsdom has no canvas; the series and the chart options (alert bands, drag to zoom) have their own specs.
    TestBed.overrideComponent(ChartFigure, {
      remove: { imports: [BaseChartDirective] },
      add: { schemas: [NO_ERRORS_SCHEMA] },
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(query: { from?: string; to?: string } = {}) {
    const fixture = TestBed.createComponent(History);
    fixture.componentRef.setInput('id', 'van-1');
    if (query.from) fixture.componentRef.setInput('from', query.from);
    if (query.to) fixture.componentRef.setInput('to', query.to);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    const readings = http.expectOne((r) => r.url === '/api/systems/van-1/readings');
    const alerts = http.expectOne((r) => r.url === '/api/systems/van-1/alerts');
    return { fixture, readings, alerts, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('asks for the last 24 hours when the link names no range', async () => {
    const { readings, alerts } = await render();
    expect(readings.request.params.get('from')).toBe(new Date(NOW - 24 * HOUR).toISOString());
    expect(readings.request.params.get('to')).toBe(new Date(NOW).toISOString());
    expect(alerts.request.params.get('from')).toBe(new Date(NOW - 24 * HOUR).toISOString());
  });

  it('opens the range named in a deep link', async () => {
    const { readings } = await render({ from: '2026-12-01T22:00:00.000Z', to: '2026-12-02T02:00:00.000Z' });
    expect(readings.request.params.get('from')).toBe('2026-12-01T22:00:00.000Z');
    expect(readings.request.params.get('to')).toBe('2026-12-02T02:00:00.000Z');
  });

  it('lists the alerts of the range and says how the readings were downsampled', async () => {
    const { fixture, readings, alerts } = await render();
    readings.flush({
      resolution: '5m',
      columns: toHistoryColumns([{ measuredAt: NOW - HOUR, voltage: 13.2, current: 3, temperature: -1 }]),
    });
    alerts.flush({ alerts: [alert] });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent!;
    expect(text).toContain(flagText('cold-charging').title);
    expect(text).toContain('one point per 5 min');
    expect(text).toContain('1 alert in this range');
  });

  it('puts a chosen preset in the address', async () => {
    const { loader, readings, alerts } = await render();
    readings.flush({ resolution: 'raw', columns: { measuredAt: [] } });
    alerts.flush({ alerts: [] });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: '7 d' }))).check();
    expect(navigate).toHaveBeenCalledWith(['/systems', 'van-1', 'history'], {
      queryParams: { from: new Date(NOW - 7 * 24 * HOUR).toISOString(), to: new Date(NOW).toISOString() },
    });
  });

  it('refuses a custom range that ends before it starts', async () => {
    const { fixture, loader, readings, alerts } = await render();
    readings.flush({ resolution: 'raw', columns: { measuredAt: [] } });
    alerts.flush({ alerts: [] });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=from]' }))
    ).setValue('2026-12-02T10:00');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=to]' }))
    ).setValue('2026-12-02T09:00');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Show range' }))).click();
    expect(navigate).not.toHaveBeenCalled();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('The end must be after the start.');
  });

  it('shows an error when the readings cannot be loaded', async () => {
    const { fixture, readings, alerts } = await render();
    readings.flush({ error: { code: 'boom', message: 'x' } }, { status: 500, statusText: 'Error' });
    alerts.flush({ alerts: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain(
      'could not be loaded',
    );
  });

  it('zooms into an alert’s time when asked', async () => {
    const { loader, readings, alerts } = await render();
    readings.flush({ resolution: 'raw', columns: { measuredAt: [] } });
    alerts.flush({ alerts: [alert] });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Zoom to it' }))).click();
    expect(navigate).toHaveBeenCalledWith(['/systems', 'van-1', 'history'], {
      queryParams: {
        from: new Date(NOW - 6 * HOUR).toISOString(),
        to: new Date(NOW - 3 * HOUR).toISOString(),
      },
    });
  });

  it('shows every series at first and hides or shows one with a single click', async () => {
    const { fixture, loader, readings, alerts } = await render();
    readings.flush({
      resolution: 'raw',
      columns: toHistoryColumns([{ measuredAt: NOW - HOUR, voltage: 13, current: 1, temperature: -4 }]),
    });
    alerts.flush({ alerts: [] });
    const hidden = () =>
      (
        fixture.componentInstance as unknown as {
          chartData(): { datasets: { label: string; hidden: boolean }[] };
        }
      )
        .chartData()
        .datasets.filter((d) => d.hidden)
        .map((d) => d.label);
    expect(hidden()).toEqual([]);
    const temperature = await loader.getHarness(MatCheckboxHarness.with({ label: /Temperature/ }));
    expect(await temperature.isChecked()).toBe(true);
    await temperature.toggle();
    expect(hidden()).toEqual(['Temperature (°C)']);
    await temperature.toggle();
    expect(hidden()).toEqual([]);
    const charge = await loader.getHarness(MatCheckboxHarness.with({ label: /State of charge/ }));
    await charge.toggle();
    expect(hidden()).toEqual(['State of charge (%)']);
  });

  it('writes every date and time on the screen in one format of the viewer’s locale', async () => {
    const { fixture, readings, alerts } = await render({
      from: '2026-12-02T06:00:00.000Z',
      to: '2026-12-02T10:00:00.000Z',
    });
    readings.flush({ resolution: '240s', columns: { measuredAt: [] } });
    alerts.flush({
      alerts: [{ ...alert, startedAt: Date.UTC(2026, 11, 2, 7), endedAt: Date.UTC(2026, 11, 2, 8) }],
    });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
    const format = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
    expect(text).toContain(
      `${format.format(Date.UTC(2026, 11, 2, 6))} – ${format.format(Date.UTC(2026, 11, 2, 10))}`,
    );
    expect(text).toContain(
      `${format.format(Date.UTC(2026, 11, 2, 7))} – ${format.format(Date.UTC(2026, 11, 2, 8))}`,
    );
    expect(text).toContain('one point per 4 min');
  });
});

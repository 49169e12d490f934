import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { AlertEvent } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { flagText } from '../core/flag-text';
import { Preferences } from '../core/preferences';
import { Alerts } from './alerts';

const NOW = Date.UTC(2026, 11, 2, 12, 0, 0);
const HOUR = 3_600_000;

const alert = (id: string, over: Partial<AlertEvent> = {}): AlertEvent => ({
  id,
  systemId: 'van-1',
  kind: 'low-charge',
  severity: 'warning',
  startedAt: NOW - 10 * HOUR,
  endedAt: NOW - 9 * HOUR,
  peakValue: 17,
  unit: '%',
  acknowledgedAt: null,
  acknowledgedBy: null,
  note: null,
  ...over,
});

describe('Alerts', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [Alerts],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(body: object, status = 200) {
    const fixture = TestBed.createComponent(Alerts);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http
      .expectOne((r) => r.url === '/api/systems/van-1/alerts')
      .flush(body, { status, statusText: status === 200 ? 'OK' : 'Error' });
    await fixture.whenStable();
    return {
      fixture,
      http,
      loader: TestbedHarnessEnvironment.loader(fixture),
      root: TestbedHarnessEnvironment.documentRootLoader(fixture),
    };
  }

  async function column(loader: ReturnType<typeof TestbedHarnessEnvironment.loader>, name: string) {
    const table = await loader.getHarness(MatTableHarness);
    return (await table.getCellTextByColumnName())[name]?.text ?? [];
  }

  it('lists the alerts newest first with their flag, severity and worst value', async () => {
    const { loader } = await render({
      alerts: [
        alert('old', { startedAt: NOW - 20 * HOUR }),
        alert('new', {
          kind: 'over-temperature',
          severity: 'critical',
          peakValue: 51.5,
          unit: 'Cel',
          endedAt: null,
        }),
      ],
    });
    expect(await column(loader, 'title')).toEqual([
      flagText('over-temperature').title,
      flagText('low-charge').title,
    ]);
    expect((await column(loader, 'severity'))[0]).toContain('Critical');
    expect((await column(loader, 'peakValue'))[0]).toBe('51.5 °C');
    expect((await column(loader, 'endedAt'))[0]).toBe('Still active');
  });

  it('narrows the list with the filter', async () => {
    const { loader } = await render({
      alerts: [alert('a', { note: 'Inverter left on' }), alert('b', { kind: 'device-silent' })],
    });
    await (await loader.getHarness(MatInputHarness.with({ selector: '[type=search]' }))).setValue('inverter');
    const titles = await column(loader, 'title');
    expect(titles).toHaveLength(1);
    expect(titles[0]).toContain('Inverter left on');
  });

  it('sorts by severity when that header is clicked', async () => {
    const { loader } = await render({
      alerts: [
        alert('w', { startedAt: NOW - HOUR }),
        alert('c', { severity: 'critical', kind: 'over-temperature' }),
      ],
    });
    const [header] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Severity' });
    await header.click();
    await header.click();
    expect((await column(loader, 'severity'))[0]).toContain('Critical');
  });

  it('pages through many alerts ten at a time', async () => {
    const many = Array.from({ length: 12 }, (_, i) => alert(`a${i}`, { startedAt: NOW - (i + 1) * HOUR }));
    const { loader } = await render({ alerts: many });
    expect(await column(loader, 'title')).toHaveLength(10);
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    expect(await column(loader, 'title')).toHaveLength(2);
  });

  it('acknowledges an alert with a note, and insists on the note', async () => {
    const { fixture, loader, root, http } = await render({ alerts: [alert('a1')] });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    const submit = await dialog.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }));
    await submit.click();
    expect(await dialog.getText()).toContain('Write a short note');
    http.expectNone('/api/systems/van-1/alerts/a1/acknowledge');

    await (await dialog.getHarness(MatInputHarness)).setValue('Fridge door was open; closed it.');
    await submit.click();
    const request = http.expectOne('/api/systems/van-1/alerts/a1/acknowledge');
    expect(request.request.body).toEqual({ note: 'Fridge door was open; closed it.' });
    request.flush(
      alert('a1', {
        acknowledgedAt: NOW,
        acknowledgedBy: { id: 'u1', displayName: 'Ines' },
        note: 'Fridge door was open; closed it.',
      }),
    );
    // The dialog hands the updated alert back once it has closed.
    jest.advanceTimersByTime(1000);
    await fixture.whenStable();
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    expect((await column(loader, 'state'))[0]).toContain('Ines');
  });

  it('shows the server’s message under the note when it refuses it', async () => {
    const { loader, root, http } = await render({ alerts: [alert('a1')] });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness)).setValue('ok');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).click();
    http.expectOne('/api/systems/van-1/alerts/a1/acknowledge').flush(
      {
        error: {
          code: 'invalid-note',
          message: 'The note contains characters we cannot store.',
          field: 'note',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(await dialog.getText()).toContain('The note contains characters we cannot store.');
  });

  it('links each alert to its moment on the history chart', async () => {
    const { fixture } = await render({ alerts: [alert('a1')] });
    const link = (fixture.nativeElement as HTMLElement).querySelector('table a[href*="history"]');
    expect(link?.getAttribute('href')).toBe(
      '/systems/van-1/history?from=2026-12-02T01:00:00.000Z&to=2026-12-02T04:00:00.000Z',
    );
  });

  it('says so when there are no alerts', async () => {
    const { fixture } = await render({ alerts: [] });
    expect(fixture.nativeElement.textContent).toContain('No alerts recorded');
  });

  it('shows an error when the alerts cannot be loaded', async () => {
    const { fixture } = await render({ error: { code: 'boom', message: 'x' } }, 500);
    expect(fixture.nativeElement.querySelector('[role="alert"]')).not.toBeNull();
  });

  it('shows a temperature alert’s worst value in °F when the person prefers it', async () => {
    TestBed.inject(Preferences).load().subscribe();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/me/preferences')
      .flush({ preferences: { temperatureUnit: 'F', emailFlags: [] } });
    const { loader } = await render({
      alerts: [alert('cold', { kind: 'cold-charging', severity: 'critical', peakValue: -3, unit: '°C' })],
    });
    // NIST SP 811 (2008), B.9: −3 °C × 1.8 + 32 = 26.6 °F.
    expect(await column(loader, 'peakValue')).toEqual(['26.6 °F']);
  });

  it('says access has ended rather than blaming the connection when the system is gone', async () => {
    const { fixture } = await render({ error: { code: 'not_found', message: 'System not found' } }, 404);
    const text = (fixture.nativeElement as HTMLElement).textContent!;
    expect(text).toContain('Your access to this system has ended');
    expect(text).not.toContain('connection');
  });

  it('tells a person with a view grant they cannot acknowledge, and offers no Acknowledge button', async () => {
    const user = {
      id: 'u9',
      email: 'sam@example.com',
      displayName: 'Sam',
      roles: ['support'],
      companyId: 'c1',
    };
    Object.defineProperty(TestBed.inject(Auth), 'currentUser', { value: signal(user) });
    const { fixture, http, loader } = await render({ alerts: [alert('a')] });
    http.expectOne('/api/systems/van-1').flush({
      system: {
        id: 'van-1',
        name: 'Blue van',
        kind: 'van',
        chemistry: 'lifepo4',
        nominalVoltage: 12,
        ratedCapacityAh: 200,
        usableCapacityAh: 180,
        latestReading: null,
        allowedActions: ['view', 'export', 'read-audit'],
      },
    });
    http.expectOne('/api/grants/received').flush({ grants: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'You can read these alerts but not acknowledge them',
    );
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Acknowledge' }))).toHaveLength(0);
  });
});

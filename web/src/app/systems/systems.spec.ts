import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { SystemStatus } from '@cellwarden/shared';
import type { SystemSummary } from '../core/system-summary';
import { flagText } from '../core/flag-text';
import { Systems } from './systems';

const NOW = Date.UTC(2026, 11, 2, 6, 0, 0);

function system(id: string, name: string, ageMs: number, stateOfCharge = 76): SystemSummary {
  return {
    id,
    name,
    kind: 'van',
    chemistry: 'lifepo4',
    nominalVoltage: 12,
    ratedCapacityAh: 200,
    usableCapacityAh: 180,
    latestReading: {
      measuredAt: NOW - ageMs,
      receivedAt: NOW - ageMs,
      voltage: 13.25,
      current: 4.2,
      temperature: 18,
      stateOfCharge,
    },
  };
}

function status(id: string, flags: NonNullable<SystemStatus['derived']>['activeFlags']): SystemStatus {
  return {
    systemId: id,
    latestReading: null,
    derived: {
      stateOfCharge: null,
      stateOfChargeSource: null,
      hoursToEmpty: null,
      hoursToFull: null,
      meanCurrent: null,
      byMorning: null,
      activeFlags: flags,
    },
    activeAlerts: [],
  };
}

describe('Systems (fleet)', () => {
  beforeEach(() => {
    // The clock advances with real time so harness polling can settle; only "now" is pinned.
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [Systems],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(body: object, status = 200, statuses: Record<string, SystemStatus> = {}) {
    const fixture = TestBed.createComponent(Systems);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems').flush(body, { status, statusText: status === 200 ? 'OK' : 'Error' });
    await fixture.whenStable();
    for (const request of http.match((r) => r.url.endsWith('/status'))) {
      const id = decodeURIComponent(request.request.url.split('/')[3]);
      if (statuses[id]) request.flush({ status: statuses[id] });
      else
        request.flush(
          { error: { code: 'not-found', message: 'x' } },
          { status: 404, statusText: 'Not Found' },
        );
    }
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  async function namesInOrder(loader: ReturnType<typeof TestbedHarnessEnvironment.loader>) {
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    return cells['name'].text.map((text) => text.split('12 V')[0].trim());
  }

  it('marks a system that has gone silent with an icon and words, not only colour', async () => {
    const { loader } = await render({
      systems: [system('a', 'Fresh van', 30_000), system('b', 'Old cabin', 180_000)],
    });
    const table = await loader.getHarness(MatTableHarness);
    const flags = (await table.getCellTextByColumnName())['flags'].text;
    expect(flags).toEqual(
      expect.arrayContaining([expect.stringContaining('Silent'), expect.stringContaining('OK')]),
    );
  });

  it('shows the state of charge, voltage and active flags of each system', async () => {
    const { loader } = await render({ systems: [system('a', 'Fresh van', 30_000)] }, 200, {
      a: status('a', [{ kind: 'over-temperature', severity: 'critical', since: NOW, peakValue: 51 }]),
    });
    const table = await loader.getHarness(MatTableHarness);
    const [row] = await table.getRows();
    const text = await row.getCellTextByColumnName();
    expect(text['stateOfCharge']).toBe('76 %');
    expect(text['voltage']).toBe('13.25 V');
    expect(text['flags']).toContain('Critical flag');
    expect(text['flags']).toContain(flagText('over-temperature').title);
  });

  it('lists systems needing attention first', async () => {
    const { loader } = await render(
      { systems: [system('a', 'Calm boat', 30_000), system('b', 'Hot cabin', 30_000)] },
      200,
      { b: status('b', [{ kind: 'low-charge', severity: 'warning', since: NOW, peakValue: 18 }]) },
    );
    expect(await namesInOrder(loader)).toEqual(['Hot cabin', 'Calm boat']);
  });

  it('sorts by state of charge when that header is clicked', async () => {
    const { loader } = await render({
      systems: [system('a', 'High van', 30_000, 90), system('b', 'Low van', 30_000, 20)],
    });
    const sort = await loader.getHarness(MatSortHarness);
    const [header] = await sort.getSortHeaders({ label: 'State of charge' });
    await header.click();
    expect(await namesInOrder(loader)).toEqual(['Low van', 'High van']);
  });

  it('narrows the list to systems matching the search', async () => {
    const { loader } = await render({
      systems: [system('a', 'Blue van', 30_000), system('b', 'Lake cabin', 30_000)],
    });
    await (await loader.getHarness(MatInputHarness)).setValue('lake');
    expect(await namesInOrder(loader)).toEqual(['Lake cabin']);
  });

  it('says so when the user has no systems', async () => {
    const { fixture } = await render({ systems: [] });
    expect(fixture.nativeElement.textContent).toContain('No systems yet');
  });

  it('shows an error when the list cannot be loaded', async () => {
    const { fixture } = await render({ error: { code: 'boom', message: 'x' } }, 500);
    expect(fixture.nativeElement.querySelector('[role="alert"]')).not.toBeNull();
  });
});

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { provideRouter } from '@angular/router';
import type { SystemSummary } from '../core/system-summary';
import { Systems } from './systems';

const NOW = Date.UTC(2026, 11, 2, 6, 0, 0);

function system(id: string, name: string, ageMs: number): SystemSummary {
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
      stateOfCharge: 76,
    },
  };
}

describe('Systems', () => {
  beforeEach(() => {
    // The clock advances with real time so harness polling can settle; only "now" is pinned.
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [Systems],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(body: unknown, status = 200) {
    const fixture = TestBed.createComponent(Systems);
    fixture.detectChanges();
    const request = TestBed.inject(HttpTestingController).expectOne('/api/systems');
    request.flush(body, { status, statusText: status === 200 ? 'OK' : 'Error' });
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('marks a system stale when its latest reading is older than two minutes', async () => {
    const { loader } = await render({
      systems: [system('a', 'Fresh van', 30_000), system('b', 'Old cabin', 180_000)],
    });
    const fresh = await loader.getHarness(MatCardHarness.with({ title: 'Fresh van' }));
    const old = await loader.getHarness(MatCardHarness.with({ title: 'Old cabin' }));
    expect(await fresh.getText()).not.toContain('Stale');
    expect(await old.getText()).toContain('Stale');
  });

  it('shows the values with units and the current direction', async () => {
    const { loader } = await render({ systems: [system('a', 'Fresh van', 30_000)] });
    const text = await (await loader.getHarness(MatCardHarness)).getText();
    expect(text).toContain('76 %');
    expect(text).toContain('13.25 V');
    expect(text).toContain('4.2 A (charging)');
    expect(text).toContain('18.0 °C');
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

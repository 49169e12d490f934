import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { until } from '../until-settled';
import { ReadingsExport } from './readings-export';

const NOW = Date.UTC(2026, 11, 3, 12);

describe('ReadingsExport', () => {
  let saved: Blob[];
  beforeEach(() => {
    jest.spyOn(Date, 'now').mockReturnValue(NOW);
    saved = [];
    URL.createObjectURL = (blob: Blob) => (saved.push(blob), 'blob:csv');
    URL.revokeObjectURL = () => undefined;
    jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    TestBed.configureTestingModule({
      imports: [ReadingsExport],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
  });
  afterEach(() => {
    jest.restoreAllMocks();
  });

  async function render() {
    const fixture = TestBed.createComponent(ReadingsExport);
    fixture.componentRef.setInput('systemId', 'van 1');
    await fixture.whenStable();
    return {
      fixture,
      http: TestBed.inject(HttpTestingController),
      loader: TestbedHarnessEnvironment.loader(fixture),
      text: () => (fixture.nativeElement as HTMLElement).textContent ?? '',
    };
  }

  it('downloads the last hour as a file, showing the bytes received while it streams', async () => {
    const { fixture, http, loader, text } = await render();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Last hour' }))).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Download CSV' }))).click();
    const request = http.expectOne((r) => r.url === '/api/systems/van%201/readings.csv');
    expect(request.request.params.get('from')).toBe(new Date(NOW - 3600_000).toISOString());
    expect(request.request.params.get('to')).toBe(new Date(NOW).toISOString());
    expect(request.request.responseType).toBe('blob');

    request.event({ type: HttpEventType.DownloadProgress, loaded: 48_200 });
    await fixture.whenStable();
    expect(text()).toContain('48.2 kB received');
    expect(await (await loader.getHarness(MatProgressBarHarness)).getMode()).toBe('indeterminate');

    request.flush(new Blob(['measured_at,voltage_v\n']));
    await fixture.whenStable();
    expect(saved).toHaveLength(1);
    expect(text()).toContain('Saved cellwarden-readings-2026-12-03T1100Z.csv');
  });

  it('shows a determinate bar when the server gives the length', async () => {
    const { fixture, http, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Download CSV' }))).click();
    http
      .expectOne((r) => r.url.endsWith('/readings.csv'))
      .event({ type: HttpEventType.DownloadProgress, loaded: 250, total: 1000 });
    await fixture.whenStable();
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getMode()).toBe('determinate');
    expect(await bar.getValue()).toBe(25);
  });

  it('refuses a custom range that ends before it starts, before asking the server', async () => {
    const { fixture, http, loader, text } = await render();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Custom range' }))).check();
    const [from, to] = Array.from(
      (fixture.nativeElement as HTMLElement).querySelectorAll<HTMLInputElement>(
        'input[type="datetime-local"]',
      ),
    );
    from.value = '2026-12-03T10:00';
    from.dispatchEvent(new Event('input'));
    to.value = '2026-12-02T10:00';
    to.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(text()).toContain('The end must be after the start.');
    expect(
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Download CSV' }))).isDisabled(),
    ).toBe(true);
    http.expectNone(() => true);
  });

  it('says why the server refused, read from the error body', async () => {
    const { fixture, http, loader, text } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Download CSV' }))).click();
    http
      .expectOne((r) => r.url.endsWith('/readings.csv'))
      .flush(
        new Blob([
          JSON.stringify({
            error: { code: 'forbidden', message: 'Your access to this system does not include "export"' },
          }),
        ]),
        { status: 403, statusText: 'Forbidden' },
      );
    // The Blob body is read by a FileReader, which answers on a later task.
    await until(() => text().includes('Nothing downloaded'), fixture);
    expect(text()).toContain('Nothing downloaded: Your access to this system does not include "export"');
    expect(saved).toHaveLength(0);
  });
});

import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { until } from '../until-settled';
import { ReadingsImport } from './readings-import';

const HEADER = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';
const ROW = (minute: number, voltage = '26.4') =>
  `2026-12-03T10:${String(minute).padStart(2, '0')}:00.000Z,${voltage},-3.2,18.5,55,-84.5`;

describe('ReadingsImport', () => {
  beforeEach(() => {
    jest.spyOn(Date, 'now').mockReturnValue(Date.UTC(2026, 11, 3, 12));
    TestBed.configureTestingModule({
      imports: [ReadingsImport],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
  });
  afterEach(() => jest.restoreAllMocks());

  async function renderWithFile(lines: string[]) {
    const fixture = TestBed.createComponent(ReadingsImport);
    fixture.componentRef.setInput('systemId', 'cabin');
    await fixture.whenStable();
    const root = fixture.nativeElement as HTMLElement;
    const input = root.querySelector<HTMLInputElement>('input[type="file"]')!;
    const file = new File([lines.join('\n')], 'van-last-hour.csv', { type: 'application/vnd.ms-excel' });
    Object.defineProperty(input, 'files', { value: [file] });
    input.dispatchEvent(new Event('change'));
    const text = () => root.textContent ?? '';
    await until(() => text().includes('First rows') || !!root.querySelector('[role="alert"]'), fixture);
    return {
      fixture,
      file,
      text,
      http: TestBed.inject(HttpTestingController),
      loader: TestbedHarnessEnvironment.loader(fixture),
    };
  }

  it('labels the file input so it can be found and reached by keyboard', async () => {
    const fixture = TestBed.createComponent(ReadingsImport);
    fixture.componentRef.setInput('systemId', 'cabin');
    await fixture.whenStable();
    const root = fixture.nativeElement as HTMLElement;
    const input = root.querySelector('input[type="file"]')!;
    expect(root.querySelector(`label[for="${input.id}"]`)?.textContent).toBe('CSV file of readings');
    expect(input.getAttribute('tabindex')).not.toBe('-1');
  });

  it('previews the first rows, with the line and column of a row the server would refuse', async () => {
    const { loader } = await renderWithFile([HEADER, ROW(0), ROW(1, '=2+5'), ROW(2)]);
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['line'].text).toEqual(['2', '3', '4']);
    expect(cells['voltage'].text[0]).toBe('26.4 V');
    expect(cells['measuredAt'].text[1]).toMatch(
      /^Column voltage_v: voltage_v must be a plain decimal number/,
    );
  });

  it('refuses a foreign header before anything is sent', async () => {
    const { text, http, loader } = await renderWithFile(['time,volts', '2026-01-01T00:00:00Z,12']);
    expect(text()).toContain('the header must be measured_at,voltage_v');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Import file' }))).isDisabled()).toBe(
      true,
    );
    http.expectNone(() => true);
  });

  it('uploads the file as text/csv with progress, then says how many readings were stored', async () => {
    const { fixture, file, text, http, loader } = await renderWithFile([HEADER, ROW(0), ROW(1)]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Import file' }))).click();
    const request = http.expectOne({ method: 'POST', url: '/api/systems/cabin/readings/import' });
    expect(request.request.headers.get('Content-Type')).toBe('text/csv');
    expect(request.request.body).toBe(file);

    request.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 160 });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatProgressBarHarness)).getValue()).toBe(25);
    expect(text()).toContain('40 bytes of 160 bytes sent');

    request.flush({ import: { rows: 2, stored: 1, duplicates: 1 } });
    await fixture.whenStable();
    expect(text()).toContain('Stored 1 readings; 1 were already stored and were skipped.');
  });

  it('says nothing was stored, naming the line and column the server refused', async () => {
    const { text, http, loader, fixture } = await renderWithFile([HEADER, ROW(0), ROW(1)]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Import file' }))).click();
    http.expectOne({ method: 'POST' }).flush(
      {
        error: {
          code: 'invalid_input',
          message: 'line 3: temperature_c must be between -40 and 85 °C; got 120',
          field: 'temperature_c',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await until(() => text().includes('Nothing stored'), fixture);
    expect(text()).toContain(
      'Nothing stored: line 3, column temperature_c: temperature_c must be between -40 and 85 °C; got 120',
    );
  });

  it('explains a refusal for want of configure access', async () => {
    const { text, http, loader, fixture } = await renderWithFile([HEADER, ROW(0)]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Import file' }))).click();
    http
      .expectOne({ method: 'POST' })
      .flush(
        { error: { code: 'forbidden', message: 'Your access to this system does not include "configure"' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await until(() => text().includes('Nothing stored'), fixture);
    expect(text()).toContain('Importing needs configure access to this system');
  });
});

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import type { CommissioningCheck } from '@cellwarden/shared';
import { Commissioning } from './commissioning';

const T0 = Date.UTC(2026, 11, 2, 9);
const SETTINGS = {
  chargeSources: [
    { id: 'dcdc-1', kind: 'dc-dc', label: 'Alternator charger', ratedCurrentA: 30 },
    { id: 'solar-1', kind: 'solar', label: 'Roof solar', ratedCurrentA: 20 },
  ],
};

function check(
  status: CommissioningCheck['status'],
  secondsMeasured: number,
  reasons: string[] = [],
): CommissioningCheck {
  return {
    id: 'k1',
    systemId: 's1',
    sourceId: 'dcdc-1',
    ratedCurrentA: 30,
    tolerancePercent: 10,
    status,
    progress: { phase: 'measuring bulk current', secondsMeasured, secondsNeeded: 60 },
    startedAt: T0,
    finishedAt: status === 'running' ? null : T0 + 90_000,
    installer: { id: 'u5', displayName: 'Robin' },
    result:
      status === 'running'
        ? null
        : {
            meanCurrentA: 29.2,
            minCurrentA: 28.6,
            maxCurrentA: 29.9,
            ripplePeakToPeakA: 1.3,
            batteryVoltageReached: 13.9,
            cableDropV: 0.18,
            reasons,
          },
  };
}

describe('Commissioning', () => {
  afterEach(() => jest.useRealTimers());

  async function render() {
    TestBed.configureTestingModule({
      imports: [Commissioning],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(Commissioning);
    fixture.componentRef.setInput('id', 's1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems/s1/settings').flush({ settings: SETTINGS });
    http.expectOne('/api/systems/s1/commissioning-checks').flush({ checks: [] });
    http.expectOne('/api/systems/s1/uploads').flush({ uploads: [] });
    await fixture.whenStable();
    return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('names the missing source when a check is started empty', async () => {
    const { http, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Start check' }))).click();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Charge source' }));
    expect(await field.getTextErrors()).toEqual(['Charge source is required.']);
    http.expectNone({ method: 'POST' });
  });

  it('refuses a watch time outside 60 to 1800 s', async () => {
    const { loader } = await render();
    const window = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName="windowSeconds"]' }),
    );
    await window.setValue('30');
    await window.blur();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Watch for' }));
    expect(await field.getTextErrors()).toEqual(['Watch for must be 60 to 1800 s.']);
  });

  it('starts a check, shows progress while it runs, polls every 2 s and shows the result', async () => {
    const { fixture, http, loader } = await render();
    const source = await loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName="sourceId"]' }),
    );
    await source.open();
    await source.clickOptions({ text: 'Alternator charger (30 A)' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Start check' }))).click();
    const start = http.expectOne({ method: 'POST', url: '/api/systems/s1/commissioning-checks' });
    expect(start.request.body).toEqual({
      sourceId: 'dcdc-1',
      ratedCurrentA: 30,
      tolerancePercent: 10,
      windowSeconds: 300,
    });

    jest.useFakeTimers();
    start.flush({ check: check('running', 0) });
    fixture.detectChanges();
    const bar = () => fixture.nativeElement.querySelector('mat-progress-bar');
    expect(bar()).not.toBeNull();

    jest.advanceTimersByTime(2000);
    http.expectOne('/api/systems/s1/commissioning-checks/k1').flush({ check: check('running', 30) });
    fixture.detectChanges();
    expect(bar().getAttribute('aria-valuenow')).toBe('50');

    jest.advanceTimersByTime(2000);
    http
      .expectOne('/api/systems/s1/commissioning-checks/k1')
      .flush({ check: check('failed', 60, ['mean 29.2 A is 2.7 % below the 30 A rating']) });
    fixture.detectChanges();
    expect(bar()).toBeNull();
    const current = fixture.nativeElement.querySelector('.current').textContent;
    expect(current).toContain('Failed');
    expect(current).toContain('mean 29.2 A is 2.7 % below the 30 A rating');
    expect(current).toContain('29.2 A');

    jest.advanceTimersByTime(10_000);
    http.expectNone('/api/systems/s1/commissioning-checks/k1');
    http.expectOne('/api/systems/s1/commissioning-checks').flush({ checks: [check('failed', 60)] });
  });

  it('downloads the record with the session, not as a bare link', async () => {
    const { http, loader } = await render();
    const createObjectURL = jest.fn(() => 'blob:record');
    Object.assign(URL, { createObjectURL, revokeObjectURL: jest.fn() });
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Download record/ }))).click();
    const request = http.expectOne('/api/systems/s1/commissioning-record.pdf');
    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob(['%PDF-1.7'], { type: 'application/pdf' }));
    expect(createObjectURL).toHaveBeenCalled();
    expect(click).toHaveBeenCalled();
  });

  it('e-mails the record to the owner', async () => {
    const { http, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: /E-mail to owner/ }))).click();
    const request = http.expectOne('/api/systems/s1/commissioning-record/email');
    expect(request.request.method).toBe('POST');
    request.flush(null, { status: 202, statusText: 'Accepted' });
  });
});

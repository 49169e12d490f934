import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { provideRouter } from '@angular/router';
import type { SystemSettings } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { Settings } from './settings';

const settings: SystemSettings = {
  name: 'Blue van',
  kind: 'van',
  timeZone: 'Europe/Lisbon',
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 180 },
  bms: { continuousDischargeA: 150, lowVoltageCutoffV: 10 },
  chargeSources: [{ id: 'solar', kind: 'solar', label: 'Roof panels', ratedCurrentA: 30 }],
  thresholds: {
    lowChargeWarningPercent: 30,
    lowChargeCriticalPercent: 10,
    lowVoltageV: 12,
    overTemperatureC: 45,
    silentAfterMinutes: 15,
  },
  thresholdDefaults: {
    lowChargeWarningPercent: 20,
    lowChargeCriticalPercent: 10,
    lowVoltageV: 12,
    overTemperatureC: 45,
    silentAfterMinutes: 15,
  },
};

// The signed-in person, as Auth holds them after a sign-in.
function signedInAs(roles: ('owner' | 'installer' | 'support' | 'admin')[]): void {
  const user = { id: 'u9', email: 'sam@example.com', displayName: 'Sam', roles, companyId: 'c1' };
  Object.defineProperty(TestBed.inject(Auth), 'currentUser', { value: signal(user) });
}

describe('Settings', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [Settings],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });

  async function render() {
    const fixture = TestBed.createComponent(Settings);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems/van-1/settings').flush({ settings });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const field = (label: string) =>
      loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    const input = async (label: string) => (await field(label)).getControl(MatInputHarness);
    const save = async () =>
      (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    return { fixture, http, loader, field, input, save };
  }

  it('fills the form with the system’s settings', async () => {
    const { input } = await render();
    expect(await (await input('Name'))!.getValue()).toBe('Blue van');
    expect(await (await input('Usable capacity (Ah)'))!.getValue()).toBe('180');
  });

  it('explains why a usable capacity above the rated one is refused, and does not save', async () => {
    const { fixture, http, input, save } = await render();
    await (await input('Usable capacity (Ah)'))!.setValue('250');
    await save();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'The usable capacity cannot be more than the rated capacity.',
    );
    http.expectNone((r) => r.method === 'PUT');
  });

  it('shows each threshold’s default and puts it back on request', async () => {
    const { loader, field, input } = await render();
    const warning = await field('Low charge warning (%)');
    expect(await warning.getTextHints()).toEqual(['Default 20\u00a0%']);
    await (
      await loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Reset Low charge warning to the default"]' }),
      )
    ).click();
    expect(await (await input('Low charge warning (%)'))!.getValue()).toBe('20');
  });

  it('adds and removes charge sources', async () => {
    const { loader, fixture } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a charge source/ }))).click();
    expect(
      (fixture.nativeElement as HTMLElement).querySelectorAll('[role=group][aria-label^="Charge source"]'),
    ).toHaveLength(2);
    await (
      await loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Remove charge source Roof panels"]' }),
      )
    ).click();
    expect(
      (fixture.nativeElement as HTMLElement).querySelectorAll('[role=group][aria-label^="Charge source"]'),
    ).toHaveLength(1);
  });

  it('saves the edited settings', async () => {
    const { http, input, save } = await render();
    await (await input('Name'))!.setValue('Green van');
    await save();
    const request = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/systems/van-1/settings');
    const { thresholdDefaults, ...expected } = settings;
    expect(thresholdDefaults).toBeDefined();
    expect(request.request.body).toEqual({ ...expected, name: 'Green van' });
  });

  it('puts the server’s message under the field it names', async () => {
    const { http, field, input, save } = await render();
    await save();
    http
      .expectOne((r) => r.method === 'PUT')
      .flush(
        { error: { code: 'invalid-time-zone', message: 'Unknown zone for this server.', field: 'timeZone' } },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(await (await input('Time zone'))!.getValue()).toBe('Europe/Lisbon');
    expect(await (await field('Time zone')).getTextErrors()).toEqual(['Unknown zone for this server.']);
  });

  it('turns read-only with an explanation when the server refuses the change (403)', async () => {
    const { fixture, http, loader, input, save } = await render();
    await save();
    http
      .expectOne((r) => r.method === 'PUT')
      .flush(
        { error: { code: 'forbidden', message: 'No configure right' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'You can see these settings but not change them',
    );
    expect(await (await input('Name'))!.isDisabled()).toBe(true);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save settings' }))).toHaveLength(0);
  });

  it('saves the temperature unit preference', async () => {
    const { http, loader } = await render();
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: 'Degrees Fahrenheit (°F)' }))).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save my preferences' }))).click();
    const request = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/me/preferences');
    expect(request.request.body).toEqual({ temperatureUnit: 'F', emailFlags: [] });
  });

  it('shows a view grant’s form disabled, with the reason, before the person tries to save', async () => {
    const { fixture, http, loader, input } = await render();
    signedInAs(['support']);
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
        allowedActions: ['view', 'export'],
      },
    });
    http.expectOne('/api/grants/received').flush({
      grants: [
        {
          id: 'g1',
          systemId: 'van-1',
          systemName: 'Blue van',
          access: 'view',
          granteeCompany: { id: 'c1', name: 'Fitters' },
          granteeUser: null,
          grantedBy: { id: 'u1', displayName: 'Mara Owner' },
          createdAt: 0,
          expiresAt: Date.UTC(2027, 0, 31, 12),
          revokedAt: null,
          active: true,
        },
      ],
    });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'You have view access to this system, granted by Mara Owner until',
    );
    expect(await (await input('Name'))!.isDisabled()).toBe(true);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save settings' }))).toHaveLength(0);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add a charge source/ }))).toHaveLength(
      0,
    );
    http.expectNone((r) => r.method === 'PUT');
  });

  it('keeps the form open for someone the server lets configure, such as the installer', async () => {
    const { fixture, http, input } = await render();
    signedInAs(['owner']);
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
        allowedActions: ['view', 'export', 'configure', 'manage-devices', 'commission'],
      },
    });
    http.expectOne('/api/grants/received').flush({ grants: [] });
    await fixture.whenStable();
    expect(await (await input('Name'))!.isDisabled()).toBe(false);
  });

  it('says access has ended, not to check the connection, when the system is no longer there to see', async () => {
    const fixture = TestBed.createComponent(Settings);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/systems/van-1/settings')
      .flush(
        { error: { code: 'not_found', message: 'System not found' } },
        { status: 404, statusText: 'Not Found' },
      );
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent!;
    expect(text).toContain('Your access to this system has ended');
    expect(text).not.toContain('connection');
  });
});

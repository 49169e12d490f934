import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { DeviceCredentials, DeviceListing } from '@cellwarden/shared';
import { Devices } from './devices';

const NOW = Date.UTC(2026, 11, 2, 12);
const SHUNT: DeviceListing = {
  id: 'van-shunt-1',
  label: 'Bench shunt',
  createdAt: NOW - 86_400_000,
  lastSeenAt: NOW,
  revokedAt: null,
};
const CREDENTIALS: DeviceCredentials = {
  device: { id: 'cabin-shunt', label: 'Cellar shunt', createdAt: NOW, lastSeenAt: null, revokedAt: null },
  mqttUsername: 'cabin-shunt',
  mqttPassword: 'k3y-only-once-7f2a',
  mqttTopic: 'cellwarden/v1/devices/cabin-shunt/readings',
  brokerPort: 1883,
  brokerUrl: 'mqtt://monitors.example:1883',
};

describe('Devices', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [Devices],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
  });

  async function render(devices: DeviceListing[]) {
    const fixture = TestBed.createComponent(Devices);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems/s1/devices').flush({ devices });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    const fill = async (id: string, label: string) => {
      await (
        await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="id"]' }))
      ).setValue(id);
      await (
        await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="label"]' }))
      ).setValue(label);
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Add device' }))).click();
    };
    return { fixture, http, loader, root, fill };
  }

  it('lists the devices with when they were last seen', async () => {
    const { loader } = await render([
      SHUNT,
      { ...SHUNT, id: 'old-meter', label: 'Old meter', lastSeenAt: null, revokedAt: NOW },
    ]);
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['label'].text).toEqual(['Bench shunt', 'Old meter']);
    expect(cells['lastSeen'].text[1]).toBe('Never');
    expect(cells['state'].text).toEqual(['active', 'revoked']);
  });

  it('refuses a device id outside the contract pattern, naming the field', async () => {
    const { http, loader, fill } = await render([]);
    await fill('Van_Shunt', 'Bench shunt');
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Device id' }));
    expect((await field.getTextErrors())[0]).toMatch(/^Device id must be 3–63 lowercase letters/);
    http.expectNone({ method: 'POST' });
  });

  it('shows the MQTT credentials once, with the warning and copy buttons', async () => {
    const { fixture, http, root, fill } = await render([]);
    await fill('cabin-shunt', 'Cellar shunt');
    const request = http.expectOne({ method: 'POST', url: '/api/systems/s1/devices' });
    expect(request.request.body).toEqual({ id: 'cabin-shunt', label: 'Cellar shunt' });
    request.flush(CREDENTIALS, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    http.expectOne('/api/systems/s1/devices').flush({ devices: [CREDENTIALS.device] });
    const dialog = await root.getHarness(MatDialogHarness);
    const text = await dialog.getText();
    expect(text).toContain('This secret is shown only now.');
    expect(text).toContain('k3y-only-once-7f2a');
    expect(text).toContain('cellwarden/v1/devices/cabin-shunt/readings');
    expect(
      await dialog.getAllHarnesses(MatButtonHarness.with({ selector: '[aria-label^="Copy "]' })),
    ).toHaveLength(5);
    expect(await dialog.getText()).toContain('mqtt://monitors.example:1883');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'I have copied it' }))).click();
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    expect(fixture.nativeElement.textContent).not.toContain('k3y-only-once-7f2a');
  });

  it('rotates a secret only after confirmation and shows the new one', async () => {
    const { fixture, http, loader, root } = await render([SHUNT]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Rotate' }))).click();
    const confirm = await root.getHarness(MatDialogHarness);
    http.expectNone({ method: 'POST' });
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Rotate' }))).click();
    http
      .expectOne({ method: 'POST', url: '/api/systems/s1/devices/van-shunt-1/rotate' })
      .flush({ ...CREDENTIALS, device: SHUNT, mqttPassword: 'n3w-secret' });
    await fixture.whenStable();
    http.expectOne('/api/systems/s1/devices').flush({ devices: [SHUNT] });
    expect(await (await root.getHarness(MatDialogHarness)).getText()).toContain('n3w-secret');
  });

  it('revokes a device after confirmation', async () => {
    const { fixture, http, loader, root } = await render([SHUNT]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
    await (
      await (await root.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Revoke' }))
    ).click();
    http
      .expectOne({ method: 'DELETE', url: '/api/systems/s1/devices/van-shunt-1' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    http.expectOne('/api/systems/s1/devices').flush({ devices: [{ ...SHUNT, revokedAt: NOW }] });
  });

  it('says why the list is refused instead of blaming the connection', async () => {
    const fixture = TestBed.createComponent(Devices);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/systems/s1/devices')
      .flush(
        {
          error: {
            code: 'forbidden',
            message: 'Your access to this system does not include "manage-devices"',
          },
        },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('does not include "manage-devices"');
    expect(alert?.textContent).not.toContain('connection');
  });
});

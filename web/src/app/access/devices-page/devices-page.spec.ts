import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@cellwarden/shared';
import { Auth } from '../../core/auth';
import { DevicesPage } from './devices-page';

describe('DevicesPage', () => {
  beforeEach(() =>
    TestBed.configureTestingModule({
      imports: [DevicesPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        // An installer: the access rule gives the installers of the system's company manage-devices.
        { provide: Auth, useValue: { hasAnyRole: (roles: readonly Role[]) => roles.includes('installer') } },
      ],
    }),
  );

  it("shows an installer the system's devices under its own navigation, marked as the page shown", async () => {
    const fixture = TestBed.createComponent(DevicesPage);
    fixture.componentRef.setInput('id', 'van');
    await fixture.whenStable();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/systems/van/devices')
      .flush({
        devices: [
          { id: 'van-shunt-1', label: 'Bench shunt', createdAt: 0, lastSeenAt: null, revokedAt: null },
        ],
      });
    await fixture.whenStable();
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('h1')?.textContent).toBe('Device management');
    expect(root.querySelector('nav [aria-current="page"]')?.getAttribute('href')).toBe(
      '/systems/van/devices',
    );
    const cells = await (
      await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTableHarness)
    ).getCellTextByColumnName();
    expect(cells['label'].text).toEqual(['Bench shunt']);
  });
});

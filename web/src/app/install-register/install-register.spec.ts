import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { InstallRegister as Register, Role } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { Preferences } from '../core/preferences';
import { InstallRegister } from './install-register';

const register: Register = {
  systemId: 'van-1',
  components: [
    {
      id: 'h',
      name: 'Diesel air heater',
      ratings: { kind: 'heater', amps: 1.5, hoursPerDay: 12, dutyCycle: 0.6, ac: false },
    },
  ],
  circuits: [
    {
      id: 'c',
      name: 'Heater feed',
      componentId: 'h',
      conductor: { awg: '12' },
      construction: 'stranded',
      oneWayLengthM: 3,
      insulationRatingC: 105,
      location: 'general',
      ambientC: 30,
      bundledConductors: 2,
      protection: { device: 'fuse', ratingA: 15, type: 'blade' },
      fuseDistanceM: 1.5,
      sheathed: false,
      designCurrentA: 10,
      allowedDropPercent: 3,
      monitoring: 'none',
      verdict: {
        ok: false,
        summary: 'a fuse 1.5 m from the battery leaves that conductor unprotected',
        rule: '33 CFR 183.455(b)',
        checkedAwg: '12',
        currentA: 10,
        ampacityA: 45,
        maximumFuseA: 67.5,
        findings: [],
      },
    },
  ],
  budget: null,
};

describe('InstallRegister', () => {
  let http: HttpTestingController;
  const unit = signal<'C' | 'F'>('C');

  beforeEach(() => {
    unit.set('C');
    TestBed.configureTestingModule({
      imports: [InstallRegister],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        {
          provide: Auth,
          useValue: { hasAnyRole: (wanted: readonly Role[]) => wanted.includes('installer') },
        },
        { provide: Preferences, useValue: { temperatureUnit: unit } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });

  async function render(allowedActions: string[]) {
    const fixture = TestBed.createComponent(InstallRegister);
    fixture.componentRef.setInput('id', 'van-1');
    fixture.detectChanges();
    http.expectOne('/api/systems/van-1/install').flush({ register });
    http.expectOne('/api/systems/van-1').flush({ system: { id: 'van-1', name: 'Moth', allowedActions } });
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it("shows each circuit's verdict with the rule it rests on", async () => {
    const page = await render(['view', 'configure']);
    const row = page.querySelector('[aria-labelledby="circuits-title"] tbody tr')!;
    expect(row.textContent).toContain('Heater feed');
    expect(row.querySelector('.verdict')!.textContent).toContain('Fails');
    expect(row.querySelector('.verdict .rule')!.textContent).toContain('Rule: 33 CFR 183.455(b)');
    expect(page.querySelector('form[aria-label="Add a circuit"]')).not.toBeNull();
  });

  it('tells a viewer they may read but not change the register, and offers no forms', async () => {
    const page = await render(['view']);
    expect(page.querySelector('.read-only')!.textContent).toMatch(/read this register but not change it/);
    expect(page.querySelector('form')).toBeNull();
  });

  it('shows the ambient in the person’s unit', async () => {
    unit.set('F');
    const page = await render(['view']);
    // °F = °C × 9/5 + 32: 30 °C is 86 °F
    expect(
      page.querySelector('[aria-labelledby="circuits-title"] tbody tr td:nth-child(3)')!.textContent,
    ).toContain('86.0 °F');
  });
});

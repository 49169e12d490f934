import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { Grant } from '@cellwarden/shared';
import { Grants } from './grants';

const NOW = Date.UTC(2026, 11, 2, 12);
const DAY = 86_400_000;

function grant(id: string, name: string, expiresAt: number, revokedAt: number | null = null): Grant {
  return {
    id,
    systemId: 's1',
    systemName: 'Blue van',
    access: 'view',
    granteeCompany: { id: `c-${id}`, name },
    granteeUser: null,
    grantedBy: { id: 'u1', displayName: 'Ana' },
    createdAt: NOW - 10 * DAY,
    expiresAt,
    revokedAt,
    active: revokedAt === null && expiresAt > NOW,
  };
}

describe('Grants', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [Grants],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(grants: Grant[]) {
    const fixture = TestBed.createComponent(Grants);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/companies').flush({ companies: [] });
    http.expectOne('/api/systems/s1/grants').flush({ grants });
    await fixture.whenStable();
    return {
      fixture,
      http,
      loader: TestbedHarnessEnvironment.loader(fixture),
      root: TestbedHarnessEnvironment.documentRootLoader(fixture),
    };
  }

  it('lists each grant with its access, expiry and state', async () => {
    const { loader } = await render([
      grant('g1', 'Harbour Volt Service', NOW + 7 * DAY),
      grant('g2', 'Old Crew Electrics', NOW - DAY),
      grant('g3', 'Dockside Fitters', NOW + DAY, NOW - 3_600_000),
    ]);
    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['grantee'].text).toEqual(['Harbour Volt Service', 'Old Crew Electrics', 'Dockside Fitters']);
    expect(rows['access'].text).toEqual(['View', 'View', 'View']);
    expect(rows['state'].text).toEqual(['active', 'expired', 'revoked']);
  });

  it('offers revoke only on active grants', async () => {
    const { loader } = await render([
      grant('g1', 'Harbour Volt Service', NOW + DAY),
      grant('g2', 'Gone Ltd', NOW - DAY),
    ]);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Revoke' }))).toHaveLength(1);
  });

  it('revokes only after the owner confirms, then reloads the list', async () => {
    const { fixture, loader, root, http } = await render([grant('g1', 'Harbour Volt Service', NOW + DAY)]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain('Harbour Volt Service loses access to Blue van');
    http.expectNone({ method: 'DELETE' });
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
    http
      .expectOne({ method: 'DELETE', url: '/api/systems/s1/grants/g1' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    http.expectOne('/api/systems/s1/grants').flush({ grants: [] });
  });

  it('does nothing when the owner cancels the revoke', async () => {
    const { loader, root, http } = await render([grant('g1', 'Harbour Volt Service', NOW + DAY)]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    http.expectNone({ method: 'DELETE' });
  });

  it('says so when nobody else has access', async () => {
    const { fixture } = await render([]);
    expect(fixture.nativeElement.textContent).toContain('Nobody else has access yet');
  });
});

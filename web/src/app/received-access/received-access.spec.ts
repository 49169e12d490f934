import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { Grant } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { ReceivedAccess } from './received-access';

const NOW = Date.UTC(2026, 11, 2, 12);
const base: Grant = {
  id: 'g1',
  systemId: 's9',
  systemName: 'Lakeside cabin',
  access: 'configure',
  granteeCompany: { id: 'c1', name: 'Harbour Volt Service' },
  granteeUser: null,
  grantedBy: { id: 'u1', displayName: 'Ana' },
  createdAt: NOW - 86_400_000,
  expiresAt: NOW + 86_400_000,
  revokedAt: null,
  active: true,
};

describe('ReceivedAccess', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [ReceivedAccess],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render(body: object, status = 200) {
    const fixture = TestBed.createComponent(ReceivedAccess);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/grants/received')
      .flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists shared systems, through whom, and links only the active ones', async () => {
    const personal = {
      ...base,
      id: 'g2',
      systemName: 'Old boat',
      granteeCompany: null,
      expiresAt: NOW - 1,
      active: false,
      granteeUser: { id: 'u3', email: 'me@example.com', displayName: 'Me' },
    };
    const { fixture, loader } = await render({ grants: [base, personal] });
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['through'].text).toEqual(['Harbour Volt Service (company)', 'You personally']);
    expect(cells['state'].text).toEqual(['active', 'expired']);
    const links = fixture.nativeElement.querySelectorAll('td a');
    expect(links).toHaveLength(1);
    expect(links[0].getAttribute('href')).toBe('/systems/s9');
  });

  it('says so when nothing is shared', async () => {
    const { fixture } = await render({ grants: [] });
    expect(fixture.nativeElement.textContent).toContain('Nobody has shared a system with you yet.');
  });

  it('shows an error when the list cannot be loaded', async () => {
    const { fixture } = await render({ error: { code: 'x', message: 'x' } }, 500);
    expect(fixture.nativeElement.querySelector('[role="alert"]')).not.toBeNull();
  });

  it('offers installers a link to the commissioning screen of each active system', async () => {
    const auth = TestBed.inject(Auth);
    jest.spyOn(auth, 'hasAnyRole').mockImplementation((roles) => roles.includes('installer'));
    const { loader } = await render({ grants: [base] });
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['tools'].text).toEqual(['Commissioning']);
  });

  it('shows owners no installer column', async () => {
    const { loader } = await render({ grants: [base] });
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['tools']).toBeUndefined();
  });
});

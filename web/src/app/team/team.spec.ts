import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Team } from './team';

const NOW = Date.UTC(2026, 11, 2, 12);

describe('Team', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [Team],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render() {
    const fixture = TestBed.createComponent(Team);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/company/members').flush({
      members: [{ id: 'u1', email: 'lee@example.com', displayName: 'Lee', roles: ['admin', 'installer'] }],
    });
    http.expectOne('/api/company/invitations').flush({
      invitations: [
        {
          id: 'i1',
          email: 'sam@example.com',
          roles: ['installer'],
          expiresAt: NOW + 86_400_000,
          acceptedAt: null,
        },
        { id: 'i2', email: 'jo@example.com', roles: ['support'], expiresAt: NOW - 1, acceptedAt: null },
      ],
    });
    await fixture.whenStable();
    return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists members with their roles in words', async () => {
    const { loader } = await render();
    const cells = await (
      await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Members"]' }))
    ).getCellTextByColumnName();
    expect(cells['roles'].text).toEqual(['Company admin, Installer']);
  });

  it('marks invitations pending or expired', async () => {
    const { loader } = await render();
    const table = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Invitations"]' }));
    const status = (await table.getCellTextByColumnName())['status'].text;
    expect(status[0]).toMatch(/^Pending/);
    expect(status[1]).toMatch(/^Ended/);
  });

  it('names the e-mail and role fields when they are missing, with no role chosen for the admin', async () => {
    const { http, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send invitation' }))).click();
    const errors = (label: string) =>
      loader
        .getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))
        .then((f) => f.getTextErrors());
    expect(await errors('E-mail')).toEqual(['E-mail is required.']);
    expect(await errors('Role')).toEqual(['Role: pick the one this person needs.']);
    http.expectNone({ method: 'POST' });
  });

  it('invites with the one role chosen, says what it may see, and leaves a clean form', async () => {
    const { fixture, http, loader } = await render();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }))
    ).setValue('pat@example.com');
    const role = await loader.getHarness(MatSelectHarness);
    await role.open();
    expect((await role.getOptions()).length).toBe(3);
    await role.clickOptions({ text: 'Support' });
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Role' }));
    expect((await field.getTextHints())[0]).toContain('shared with the company or with them');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send invitation' }))).click();
    const request = http.expectOne({ method: 'POST', url: '/api/company/invitations' });
    expect(request.request.body).toEqual({ email: 'pat@example.com', roles: ['support'] });
    request.flush(
      {
        id: 'i3',
        email: 'pat@example.com',
        roles: ['support'],
        expiresAt: NOW + 86_400_000,
        acceptedAt: null,
      },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    http.expectOne('/api/company/invitations').flush({ invitations: [] });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      'Invitation sent to pat@example.com',
    );
    const email = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));
    expect(await email.getTextErrors()).toEqual([]);
  });

  it('removes a member after a second click and withdraws an open invitation', async () => {
    const { fixture, http, loader } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Remove Lee' }))).click();
    http.expectNone({ method: 'DELETE' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Remove Lee now' }))).click();
    http
      .expectOne({ method: 'DELETE', url: '/api/company/members/u1' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    http.expectOne('/api/company/members').flush({ members: [] });
    await fixture.whenStable();
    const withdraw = await loader.getAllHarnesses(MatButtonHarness.with({ text: /^Withdraw/ }));
    expect(withdraw).toHaveLength(1);
    await withdraw[0].click();
    http
      .expectOne({ method: 'DELETE', url: '/api/company/invitations/i1' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    http.expectOne('/api/company/invitations').flush({ invitations: [] });
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toContain('its link no longer works');
  });
});

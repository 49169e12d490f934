import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import { MIN_PASSWORD_LENGTH } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { Invitation } from './invitation';

const PREVIEW = {
  email: 'new.fitter@example.com',
  roles: ['installer'],
  companyName: 'Ridgeway Power Works',
  expiresAt: Date.UTC(2026, 11, 9),
};

describe('Invitation', () => {
  async function setup(preview: { body: object; status?: number } = { body: PREVIEW }) {
    TestBed.configureTestingModule({
      imports: [Invitation],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(Invitation);
    fixture.componentRef.setInput('token', 'inv-1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http
      .expectOne('/api/auth/invitations/inv-1')
      .flush(preview.body, { status: preview.status ?? 200, statusText: 'x' });
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), http };
  }

  const input = (loader: Awaited<ReturnType<typeof setup>>['loader'], name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));

  it('shows who is invited, to which company and as what', async () => {
    const { fixture } = await setup();
    const summary = fixture.nativeElement.querySelector('[data-testid="invitation-summary"]').textContent;
    expect(summary).toContain('new.fitter@example.com');
    expect(summary).toContain('Ridgeway Power Works');
    expect(summary).toContain('Installer');
  });

  it('names every missing field when submitted empty', async () => {
    const { loader, http } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Accept and sign in' }))).click();
    const errors = async (label: string) =>
      (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();
    expect(await errors('Display name')).toEqual(['Display name is required.']);
    expect(await errors('Password')).toEqual(['Password is required.']);
    expect(await errors('Repeat the password')).toEqual(['Repeat the password to confirm it.']);
    http.expectNone('/api/auth/invitations/accept');
  });

  it('asks for the shared minimum password length', async () => {
    const { loader } = await setup();
    await (await input(loader, 'password')).setValue('x'.repeat(MIN_PASSWORD_LENGTH - 1));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Accept and sign in' }))).click();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Password' }));
    expect(await field.getTextErrors()).toEqual([
      `Password must be at least ${MIN_PASSWORD_LENGTH} characters.`,
    ]);
  });

  it('accepts, signs the new member in and opens the systems list', async () => {
    const { loader, http } = await setup();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await input(loader, 'displayName')).setValue('Robin Fitter');
    await (await input(loader, 'password')).setValue('a-long-password');
    await (await input(loader, 'confirmation')).setValue('a-long-password');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Accept and sign in' }))).click();
    const request = http.expectOne('/api/auth/invitations/accept');
    expect(request.request.body).toEqual({
      token: 'inv-1',
      displayName: 'Robin Fitter',
      password: 'a-long-password',
    });
    request.flush({
      accessToken: 'tok-1',
      expiresIn: 900,
      user: {
        id: 'u7',
        email: PREVIEW.email,
        displayName: 'Robin Fitter',
        roles: ['installer'],
        companyId: 'c1',
      },
    });
    expect(TestBed.inject(Auth).currentUser()?.displayName).toBe('Robin Fitter');
    expect(navigate).toHaveBeenCalledWith(['/systems']);
  });

  it("shows the server's reason when the invitation cannot be opened", async () => {
    const { fixture } = await setup({
      body: { error: { code: 'invitation_expired', message: 'This invitation has expired.' } },
      status: 410,
    });
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'This invitation has expired.',
    );
  });
});

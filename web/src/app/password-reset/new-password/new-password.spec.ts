import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { MIN_PASSWORD_LENGTH } from '@cellwarden/shared';
import { NewPassword } from './new-password';

describe('NewPassword', () => {
  function setup() {
    TestBed.configureTestingModule({
      imports: [NewPassword],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(NewPassword);
    fixture.componentRef.setInput('token', 'reset-token-1');
    return {
      fixture,
      loader: TestbedHarnessEnvironment.loader(fixture),
      http: TestBed.inject(HttpTestingController),
    };
  }

  async function fill(loader: ReturnType<typeof setup>['loader'], password: string, confirmation: string) {
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }))
    ).setValue(password);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="confirmation"]' }))
    ).setValue(confirmation);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Set password' }))).click();
  }

  const errorsOf = async (loader: ReturnType<typeof setup>['loader'], label: string) =>
    (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();

  it('refuses a password shorter than the shared minimum, naming the field', async () => {
    const { loader, http } = setup();
    await fill(loader, 'short', 'short');
    expect(await errorsOf(loader, 'New password')).toEqual([
      `New password must be at least ${MIN_PASSWORD_LENGTH} characters.`,
    ]);
    http.expectNone('/api/auth/password-reset/complete');
  });

  it('refuses a password longer than the 72 bytes the hash reads, counting accented letters as two', async () => {
    const { loader, http } = setup();
    const long = 'ü'.repeat(37);
    await fill(loader, long, long);
    expect((await errorsOf(loader, 'New password'))[0]).toContain('at most 72 bytes');
    http.expectNone('/api/auth/password-reset/complete');
  });

  it('says so when the confirmation differs', async () => {
    const { loader, http } = setup();
    await fill(loader, 'long-enough-pass', 'long-enough-typo');
    expect(await errorsOf(loader, 'Repeat the new password')).toEqual(['The two passwords differ.']);
    http.expectNone('/api/auth/password-reset/complete');
  });

  it('sends the token with the new password and confirms', async () => {
    const { fixture, loader, http } = setup();
    await fill(loader, 'long-enough-pass', 'long-enough-pass');
    const request = http.expectOne('/api/auth/password-reset/complete');
    expect(request.request.body).toEqual({ token: 'reset-token-1', password: 'long-enough-pass' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      'password is changed',
    );
  });

  it('shows the server refusal for an expired link', async () => {
    const { fixture, loader, http } = setup();
    await fill(loader, 'long-enough-pass', 'long-enough-pass');
    http
      .expectOne('/api/auth/password-reset/complete')
      .flush(
        { error: { code: 'token_expired', message: 'This link has expired.' } },
        { status: 410, statusText: 'Gone' },
      );
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'This link has expired.',
    );
  });
});

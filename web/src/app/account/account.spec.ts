import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { MIN_PASSWORD_LENGTH } from '@cellwarden/shared';
import { Account } from './account';

describe('Account', () => {
  function setup() {
    TestBed.configureTestingModule({
      imports: [Account],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(Account);
    fixture.detectChanges();
    return {
      fixture,
      loader: TestbedHarnessEnvironment.loader(fixture),
      http: TestBed.inject(HttpTestingController),
    };
  }

  async function fill(
    loader: ReturnType<typeof setup>['loader'],
    current: string,
    next: string,
    again: string,
  ) {
    const input = (name: string) =>
      loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
    await (await input('currentPassword')).setValue(current);
    await (await input('password')).setValue(next);
    await (await input('confirmation')).setValue(again);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Change password' }))).click();
  }

  const errorsOf = async (loader: ReturnType<typeof setup>['loader'], label: string) =>
    (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();

  it('refuses a short new password and a differing repeat before asking the server', async () => {
    const { loader, http } = setup();
    await fill(loader, 'old-password-1', 'short', 'shorter');
    expect(await errorsOf(loader, 'New password')).toEqual([
      `New password must be at least ${MIN_PASSWORD_LENGTH} characters.`,
    ]);
    expect(await errorsOf(loader, 'Repeat the new password')).toEqual(['The two passwords differ.']);
    http.expectNone('/api/auth/password');
  });

  it('sends the current and the new password, then says the other sign-ins have ended and clears the form', async () => {
    const { fixture, loader, http } = setup();
    await fill(loader, 'old-password-1', 'a new long password', 'a new long password');
    const request = http.expectOne('/api/auth/password');
    expect(request.request.body).toEqual({
      currentPassword: 'old-password-1',
      newPassword: 'a new long password',
    });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[role="status"]')?.textContent).toContain('Your other sign-ins have ended.');
    expect(await errorsOf(loader, 'Current password')).toEqual([]);
    const current = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName="currentPassword"]' }),
    );
    expect(await current.getValue()).toBe('');
  });

  it('puts a wrong current password under its own field', async () => {
    const { fixture, loader, http } = setup();
    await fill(loader, 'not-my-password', 'a new long password', 'a new long password');
    http.expectOne('/api/auth/password').flush(
      {
        error: {
          code: 'invalid_credentials',
          message: 'Current password is not correct',
          field: 'currentPassword',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await errorsOf(loader, 'Current password')).toEqual(['Current password is not correct']);
  });
});

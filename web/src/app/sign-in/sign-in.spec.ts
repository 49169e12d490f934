import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  async function setup() {
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(SignIn);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const http = TestBed.inject(HttpTestingController);
    return { fixture, loader, http };
  }

  it('says which fields are missing when submitted empty', async () => {
    const { loader, http } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    const email = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));
    const password = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Password' }));
    expect(await email.getTextErrors()).toEqual(['E-mail is required.']);
    expect(await password.getTextErrors()).toEqual(['Password is required.']);
    http.expectNone('/api/auth/sign-in');
  });

  it('says the e-mail is malformed', async () => {
    const { loader } = await setup();
    const input = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }));
    await input.setValue('not-an-address');
    await input.blur();
    const email = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));
    expect((await email.getTextErrors())[0]).toContain('valid address');
  });

  it("shows the server's error message when sign-in is refused", async () => {
    const { fixture, loader, http } = await setup();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }))
    ).setValue('ana@example.com');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }))
    ).setValue('wrong');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.body).toEqual({ email: 'ana@example.com', password: 'wrong' });
    request.flush(
      { error: { code: 'invalid_credentials', message: 'E-mail or password is wrong.' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(
      'E-mail or password is wrong.',
    );
  });

  it('goes back to the return URL after signing in', async () => {
    const { fixture, loader, http } = await setup();
    fixture.componentRef.setInput('returnUrl', '/systems/s1/access');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }))
    ).setValue('ana@example.com');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }))
    ).setValue('secret-secret');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    http.expectOne('/api/auth/sign-in').flush({
      accessToken: 'tok-1',
      expiresIn: 900,
      user: { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'], companyId: null },
    });
    expect(navigate).toHaveBeenCalledWith('/systems/s1/access');
  });

  it('ignores a return URL that leaves the app', async () => {
    const { fixture, loader, http } = await setup();
    fixture.componentRef.setInput('returnUrl', '//elsewhere.example/phish');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }))
    ).setValue('ana@example.com');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }))
    ).setValue('secret-secret');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    http.expectOne('/api/auth/sign-in').flush({
      accessToken: 'tok-1',
      expiresIn: 900,
      user: { id: 'u1', email: 'ana@example.com', displayName: 'Ana', roles: ['owner'], companyId: null },
    });
    expect(navigate).toHaveBeenCalledWith('/systems');
  });
});

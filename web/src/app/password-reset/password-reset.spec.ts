import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { PasswordReset, RESET_REQUESTED_TEXT } from './password-reset';

describe('PasswordReset', () => {
  function setup() {
    TestBed.configureTestingModule({
      imports: [PasswordReset],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(PasswordReset);
    return {
      fixture,
      loader: TestbedHarnessEnvironment.loader(fixture),
      http: TestBed.inject(HttpTestingController),
    };
  }

  it('says the e-mail is required when sent empty', async () => {
    const { loader, http } = setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send reset link' }))).click();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));
    expect(await field.getTextErrors()).toEqual(['E-mail is required.']);
    http.expectNone('/api/auth/password-reset/request');
  });

  it('answers with the same neutral text once the request is accepted', async () => {
    const { fixture, loader, http } = setup();
    await (await loader.getHarness(MatInputHarness)).setValue('nobody@example.com');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send reset link' }))).click();
    const request = http.expectOne('/api/auth/password-reset/request');
    expect(request.request.body).toEqual({ email: 'nobody@example.com' });
    request.flush(null, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      RESET_REQUESTED_TEXT,
    );
  });
});

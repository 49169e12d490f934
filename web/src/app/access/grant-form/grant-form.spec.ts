import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { GrantForm } from './grant-form';

const NOW = new Date(2026, 11, 2, 12, 0).getTime();
const DAY = 86_400_000;

describe('GrantForm', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: NOW, advanceTimers: true });
    TestBed.configureTestingModule({
      imports: [GrantForm],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
  });
  afterEach(() => jest.useRealTimers());

  async function render() {
    const fixture = TestBed.createComponent(GrantForm);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/companies').flush({ companies: [{ id: 'c7', name: 'Harbour Volt Service' }] });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const submit = () =>
      loader.getHarness(MatButtonHarness.with({ text: 'Grant access' })).then((b) => b.click());
    const errors = (label: string) =>
      loader
        .getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))
        .then((f) => f.getTextErrors());
    return { fixture, http, loader, submit, errors };
  }

  it('names the missing company and expiry when submitted empty', async () => {
    const { http, submit, errors } = await render();
    await submit();
    expect(await errors('Company')).toEqual(['Company is required.']);
    expect(await errors('Expires')).toEqual(['Expires is required: pick when the access ends.']);
    http.expectNone('/api/systems/s1/grants');
  });

  it('refuses an expiry in the past', async () => {
    const { loader, submit, errors } = await render();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="expiresAt"]' }))
    ).setValue('2026-12-01T08:00');
    await submit();
    expect(await errors('Expires')).toEqual(['Expires must be in the future.']);
  });

  it('asks for a valid e-mail when granting to a person', async () => {
    const { loader, submit, errors } = await render();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'A person by e-mail' }))).check();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="granteeEmail"]' }))
    ).setValue('kim-at-example');
    await submit();
    expect((await errors("Person's e-mail"))[0]).toContain("Person's e-mail must be a valid address");
  });

  it('sends a company grant with the 7-day quick pick as an ISO instant', async () => {
    const { http, loader, submit } = await render();
    await (
      await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="granteeCompanyId"]' }))
    ).open();
    const select = await loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName="granteeCompanyId"]' }),
    );
    await select.clickOptions({ text: 'Harbour Volt Service' });
    await (await loader.getHarness(MatButtonHarness.with({ text: '7 days' }))).click();
    await submit();
    const request = http.expectOne({ method: 'POST', url: '/api/systems/s1/grants' });
    expect(request.request.body).toEqual({
      granteeCompanyId: 'c7',
      access: 'view',
      // The datetime-local input keeps minutes, so the instant is now + 7 days to the minute.
      expiresAt: new Date(NOW + 7 * DAY).toISOString(),
    });
  });

  it("puts the server's field error under that field", async () => {
    const { fixture, http, loader, submit, errors } = await render();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'A person by e-mail' }))).check();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="granteeEmail"]' }))
    ).setValue('kim@example.com');
    await (await loader.getHarness(MatButtonHarness.with({ text: '1 day' }))).click();
    await submit();
    http.expectOne('/api/systems/s1/grants').flush(
      {
        error: {
          code: 'unknown_person',
          message: 'No account uses kim@example.com',
          field: 'granteeEmail',
        },
      },
      { status: 422, statusText: 'Unprocessable' },
    );
    await fixture.whenStable();
    expect(await errors("Person's e-mail")).toEqual(['No account uses kim@example.com']);
  });
});

import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MailOutbox } from './mail-outbox';

describe('MailOutbox', () => {
  async function render(body: object, status = 200) {
    TestBed.configureTestingModule({
      imports: [MailOutbox],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(MailOutbox);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/dev/mail').flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
    return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists captured mail newest first, with the text inside', async () => {
    const { loader } = await render({
      messages: [
        {
          id: 'm1',
          to: 'sam@example.com',
          subject: 'You are invited',
          text: 'Open /invitation/abc',
          receivedAt: 1000,
        },
        {
          id: 'm2',
          to: 'kim@example.com',
          subject: 'Reset your password',
          text: 'Open /password-reset/xyz',
          receivedAt: 2000,
        },
      ],
    });
    const panels = await loader.getAllHarnesses(MatExpansionPanelHarness);
    expect(await panels[0].getTitle()).toBe('Reset your password');
    await panels[1].expand();
    expect(await panels[1].getTextContent()).toContain('Open /invitation/abc');
  });

  it('explains that the catcher is off when the server answers 404', async () => {
    const { fixture } = await render({ error: { code: 'not_found', message: 'x' } }, 404);
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      'mail catcher is off',
    );
  });

  it('reloads on demand', async () => {
    const { fixture, http, loader } = await render({ messages: [] });
    expect(fixture.nativeElement.textContent).toContain('No mail captured yet.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Reload/ }))).click();
    await fixture.whenStable();
    http.expectOne('/api/dev/mail').flush({ messages: [] });
  });
});

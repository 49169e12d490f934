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

  it('lists your captured mail newest first, with the text inside', async () => {
    const { fixture, loader } = await render({
      catcher: true,
      address: 'sam@example.com',
      messages: [
        {
          id: 'm1',
          to: ['sam@example.com'],
          subject: 'You are invited',
          text: 'Open /invitation/abc',
          receivedAt: 1000,
        },
        {
          id: 'm2',
          to: ['sam@example.com'],
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
    expect(fixture.nativeElement.textContent).toContain('Messages to sam@example.com');
  });

  it('says it is the local catcher’s copy of your mail, not a mailbox', async () => {
    const { fixture } = await render({ catcher: true, address: 'sam@example.com', messages: [] });
    expect(fixture.nativeElement.textContent).toContain('messages addressed to you');
    expect(fixture.nativeElement.textContent).toContain('not a mailbox');
  });

  it('explains that the catcher is off when the server says so', async () => {
    const { fixture } = await render({ catcher: false, address: 'sam@example.com', messages: [] });
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      'mail catcher is off',
    );
  });

  it('reports a failed load', async () => {
    const { fixture } = await render({ error: { code: 'internal_error', message: 'x' } }, 500);
    expect(fixture.nativeElement.querySelector('[role="alert"]')).not.toBeNull();
  });

  it('reloads on demand', async () => {
    const { fixture, http, loader } = await render({ catcher: true, address: 'a@b.c', messages: [] });
    expect(fixture.nativeElement.textContent).toContain('No mail to you captured yet.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Reload/ }))).click();
    await fixture.whenStable();
    http.expectOne('/api/dev/mail').flush({ catcher: true, address: 'a@b.c', messages: [] });
  });
});

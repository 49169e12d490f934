import { createMemoryLogger } from '../logger';
import { startMailCatcher, type MailCatcher } from './mail-catcher';
import { createMailer, type Mailer } from './mailer';

describe('startMailCatcher', () => {
  let catcher: MailCatcher;
  let mailer: Mailer;

  beforeAll(async () => {
    catcher = await startMailCatcher({ host: '127.0.0.1', port: 0, limit: 2, maxMessageBytes: 64 * 1024 });
    mailer = createMailer({
      smtpUrl: catcher.url,
      from: 'alerts@cellwarden.test',
      logger: createMemoryLogger(),
    });
  });
  afterAll(async () => {
    mailer.close();
    await catcher.stop();
  });
  beforeEach(() => catcher.clear());

  const send = (subject: string) => mailer.send({ to: 'ada@example.test', subject, text: subject });

  it('keeps the newest messages first, bounded to its limit', async () => {
    for (const subject of ['first', 'second', 'third']) await send(subject);
    await catcher.waitFor((m) => m.subject === 'third', 5000);
    expect(catcher.messages().map((m) => m.subject)).toEqual(['third', 'second']);
  });

  it('refuses a message over its size limit', async () => {
    const content = Buffer.alloc(100 * 1024, 1);
    const sending = mailer.send({
      to: 'ada@example.test',
      subject: 'too big',
      text: 'x',
      attachments: [{ filename: 'big.bin', content, contentType: 'application/octet-stream' }],
    });
    await expect(sending).rejects.toMatchObject({ code: 'mail_failed' });
    expect(catcher.messages()).toHaveLength(0);
  });

  it('rejects waitFor when nothing matching arrives in time', async () => {
    await expect(catcher.waitFor((m) => m.subject === 'never', 50)).rejects.toThrow(/within 50 ms/);
  });

  it('listens on loopback only', async () => {
    await expect(startMailCatcher({ host: '0.0.0.0', port: 0, limit: 1 })).rejects.toThrow(/loopback/);
  });

  it('advertises its address as an smtp URL', () => {
    expect(catcher.url).toBe(`smtp://127.0.0.1:${catcher.port}`);
  });
});

import { AppError } from '../errors/app-error';
import { createMemoryLogger } from '../logger';
import { startMailCatcher, type MailCatcher } from './mail-catcher';
import { createMailer, type Mailer } from './mailer';

describe('createMailer against a real mail catcher', () => {
  let catcher: MailCatcher;
  let mailer: Mailer;
  const logger = createMemoryLogger();

  beforeAll(async () => {
    catcher = await startMailCatcher({ host: '127.0.0.1', port: 0, limit: 200 });
    mailer = createMailer({ smtpUrl: catcher.url, from: 'Cellwarden <alerts@cellwarden.test>', logger });
  });
  afterAll(async () => {
    mailer.close();
    await catcher.stop();
  });
  beforeEach(() => catcher.clear());

  const refusal = async (send: Promise<void>): Promise<AppError> => {
    const error = await send.then(
      () => undefined,
      (caught: unknown) => caught,
    );
    expect(error).toBeInstanceOf(AppError);
    return error as AppError;
  };

  it('delivers a message with its subject, text and recipient', async () => {
    await mailer.send({ to: 'ada.owner@example.test', subject: 'Low charge', text: 'Charge is at 18 %.' });
    const mail = await catcher.waitFor((m) => m.subject === 'Low charge', 5000);
    expect(mail.to).toEqual(['ada.owner@example.test']);
    expect(mail.from).toContain('alerts@cellwarden.test');
    expect(mail.text.trim()).toBe('Charge is at 18 %.');
  });

  it('delivers an attachment with its name, type and size', async () => {
    const content = Buffer.from('%PDF-1.3\n% a stand-in record\n%%EOF\n');
    await mailer.send({
      to: 'ada.owner@example.test',
      subject: 'Record attached',
      text: 'See the attachment.',
      attachments: [{ filename: 'commissioning-record.pdf', content, contentType: 'application/pdf' }],
    });
    const mail = await catcher.waitFor((m) => m.subject === 'Record attached', 5000);
    expect(mail.attachments).toEqual([
      { filename: 'commissioning-record.pdf', contentType: 'application/pdf', size: content.length },
    ]);
  });

  it('cannot be made to add a Bcc header through the subject or the display name', async () => {
    await mailer.send({
      to: { name: 'Ada\r\nBcc: eve@attacker.test', address: 'ada.owner@example.test' },
      subject: 'Hello\r\nBcc: eve@attacker.test',
      text: 'Nothing else.',
    });
    const mail = await catcher.waitFor((m) => m.subject.startsWith('Hello'), 5000);
    expect(mail.headerNames).not.toContain('bcc');
    expect(mail.to).toEqual(['ada.owner@example.test']);
    expect(mail.subject).not.toMatch(/[\r\n]/);
  });

  it.each([
    ['two addresses', 'ada@example.test, eve@attacker.test'],
    ['a header after the address', 'ada@example.test\r\nBcc: eve@attacker.test'],
    ['an angle-bracket mailbox', 'Ada <ada@example.test>'],
    ['no domain', 'ada'],
  ])('refuses a recipient with %s, naming the field', async (_label, to) => {
    const error = await refusal(mailer.send({ to, subject: 'Hi', text: 'x' }));
    expect(error.code).toBe('invalid_input');
    expect(error.field).toBe('to');
    expect(catcher.messages()).toHaveLength(0);
  });

  it('reports an unreachable SMTP server as mail_failed (503) and logs it', async () => {
    const stopped = await startMailCatcher({ host: '127.0.0.1', port: 0, limit: 1 });
    await stopped.stop();
    const failing = createMailer({ smtpUrl: stopped.url, from: 'alerts@cellwarden.test', logger });
    const error = await refusal(failing.send({ to: 'ada@example.test', subject: 'Hi', text: 'x' }));
    failing.close();
    expect(error.code).toBe('mail_failed');
    expect(error.status).toBe(503);
    expect(logger.entries.some((entry) => entry.level === 'error' && entry.message === 'mail failed')).toBe(
      true,
    );
  });
});

import {
  MONITORING_NOTE,
  commissioningRecordMail,
  flagClearedMail,
  flagStartedMail,
  invitationMail,
  passwordResetMail,
  type MailContent,
} from './mail-templates';

const at = Date.UTC(2026, 11, 2, 6, 30);
const notice = {
  systemName: 'Blue van\r\nBcc: eve@attacker.test',
  flagTitle: 'Low charge',
  at,
  value: '18 %',
  advice: 'Reduce the load or start charging.',
};

const endsWithNote = (mail: MailContent) => expect(mail.text.trimEnd().endsWith(MONITORING_NOTE)).toBe(true);

describe('mail templates', () => {
  it('invite with the link, the company and the expiry', () => {
    const mail = invitationMail({
      link: 'https://cw.test/invite/abc',
      companyName: 'Tallow Creek Solar',
      expiresAt: at,
    });
    expect(mail.subject).toBe('Your invitation to Tallow Creek Solar on Cellwarden');
    expect(mail.text).toContain('https://cw.test/invite/abc');
    expect(mail.text).toContain('2026-12-02 06:30 (UTC)');
    endsWithNote(mail);
  });

  it('send a password reset link with its expiry', () => {
    const mail = passwordResetMail({ link: 'https://cw.test/reset/xyz', expiresAt: at });
    expect(mail.text).toContain('https://cw.test/reset/xyz');
    expect(mail.text).toContain('until 2026-12-02 06:30 (UTC)');
    endsWithNote(mail);
  });

  it('refuse a link that is not http(s)', () => {
    expect(() => passwordResetMail({ link: 'javascript:alert(1)', expiresAt: at })).toThrow(/http/);
  });

  it('tell when a flag started, with its value and advice, never trusting the system name', () => {
    const mail = flagStartedMail({ ...notice, timeZone: 'Europe/Oslo' });
    expect(mail.subject).toBe('Blue van Bcc: eve@attacker.test: Low charge');
    expect(mail.subject).not.toMatch(/[\r\n]/);
    // Europe/Oslo is UTC+1 in December (IANA tz database, CET).
    expect(mail.text).toContain('since 2026-12-02 07:30 (Europe/Oslo)');
    expect(mail.text).toContain('Value: 18 %.');
    expect(mail.text).toContain('What to do: Reduce the load or start charging.');
    endsWithNote(mail);
  });

  it('tell when a flag cleared', () => {
    const mail = flagClearedMail({ ...notice, systemName: 'Blue van', advice: 'No action needed.' });
    expect(mail.subject).toBe('Blue van: cleared - Low charge');
    expect(mail.text).toContain('cleared at 2026-12-02 06:30 (UTC)');
    endsWithNote(mail);
  });

  it('send the commissioning record to the owner, saying it is no certificate', () => {
    const mail = commissioningRecordMail({
      systemName: 'Cabin\u0007 North',
      installerName: 'Sam Field',
      companyName: 'Tallow Creek Solar',
      recordedAt: at,
    });
    expect(mail.subject).toBe('Commissioning record for Cabin North');
    expect(mail.text).toContain('by Sam Field (Tallow Creek Solar)');
    expect(mail.text).toContain('not a certificate');
    endsWithNote(mail);
  });
});

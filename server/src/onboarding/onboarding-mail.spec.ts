import { MONITORING_NOTE } from '../mail/mail-templates';
import { accessRequestMail, handoverInvitationMail, handoverToAccountMail } from './onboarding-mail';

const words = {
  systemName: 'Fjord\r\nBcc: x@evil.example hopper',
  installerName: 'Tomas',
  companyName: 'Fitters',
};

describe('onboarding mail', () => {
  it('invites a new address with its link and until when, and says the installer keeps its rights', () => {
    const mail = handoverInvitationMail({
      ...words,
      link: 'https://cw.example/invitation/abc',
      expiresAt: Date.UTC(2026, 11, 10, 12),
    });
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.text).toContain('Tomas (Fitters) set up the battery system');
    expect(mail.text).toContain('https://cw.example/invitation/abc');
    expect(mail.text).toContain('2026');
    expect(mail.text).toContain('keeps its installer rights');
    expect(mail.text).toContain(MONITORING_NOTE);
  });

  it('tells an address that signs in already where to accept, without an invitation link', () => {
    const mail = handoverToAccountMail({ ...words, link: 'https://cw.example/requests' });
    expect(mail.text).toContain('https://cw.example/requests');
    expect(mail.text).not.toContain('/invitation/');
  });

  it('tells the owner who asks, their note, and refuses a link that is not http(s)', () => {
    const request = {
      systemName: 'Lakeside cabin',
      requesterName: 'Noor',
      requesterEmail: 'noor@fitters.example',
      companyName: null,
      note: 'Ticket 4411',
      link: 'https://cw.example/requests',
      expiresAt: Date.UTC(2026, 11, 6),
    };
    const mail = accessRequestMail(request);
    expect(mail.subject).toBe('Access request for “Lakeside cabin”');
    expect(mail.text).toContain('Noor <noor@fitters.example> asks to see');
    expect(mail.text).toContain('Their note: Ticket 4411');
    expect(() => accessRequestMail({ ...request, link: 'javascript:alert(1)' })).toThrow(/http\(s\)/);
  });
});

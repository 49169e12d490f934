import type { Mailer } from '../mail/mailer';
import { invitationForExistingAccountMail, invitationMail, passwordResetMail } from '../mail/mail-templates';
import type { AccountMail } from './account-mail';

/** The accounts component's e-mail, composed from the templates and sent through the one mailer. */
export function createAccountMail(mailer: Mailer): AccountMail {
  return {
    sendInvitation: (to, link, companyName, expiresAt) =>
      mailer.send({ to, ...invitationMail({ link, companyName, expiresAt: expiresAt.getTime() }) }),
    sendInvitationToExistingAccount: (to, companyName) =>
      mailer.send({ to, ...invitationForExistingAccountMail({ companyName }) }),
    sendPasswordReset: (to, link, expiresAt) =>
      mailer.send({ to, ...passwordResetMail({ link, expiresAt: expiresAt.getTime() }) }),
  };
}

/** The e-mails the accounts component sends; composed from the mail templates by the composition root. */
export interface AccountMail {
  sendInvitation(to: string, link: string, companyName: string | null, expiresAt: Date): Promise<void>;
  sendInvitationToExistingAccount(to: string, companyName: string | null): Promise<void>;
  sendPasswordReset(to: string, link: string, expiresAt: Date): Promise<void>;
}

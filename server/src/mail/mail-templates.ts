import { stripControlCharacters } from './control-characters';
import { formatMailTime } from './mail-time';

/** A message body ready for `Mailer.send`. */
export interface MailContent {
  subject: string;
  text: string;
}

/** What a flag notice says: names and advice come from elsewhere and are cleaned here. */
export interface FlagNotice {
  systemName: string;
  flagTitle: string;
  at: number;
  /** Already formatted with its unit, e.g. "11.6 V". */
  value: string;
  /** What to do (from the flag's advice); one or more lines. */
  advice: string;
  timeZone?: string;
}

/** The line every message ends with. */
export const MONITORING_NOTE =
  'Cellwarden monitors your battery system. It does not replace the battery management system (BMS) or its protections.';

/** An invitation to join Cellwarden (and a company, if named). */
export function invitationMail(input: {
  link: string;
  companyName?: string | null;
  expiresAt: number;
}): MailContent {
  const company = input.companyName ? stripControlCharacters(input.companyName) : '';
  const joining = company ? `${company} on Cellwarden` : 'Cellwarden';
  return compose(`Your invitation to ${joining}`, [
    `You have been invited to join ${joining}.`,
    `Open this link to choose your name and password:`,
    safeLink(input.link),
    `The link works until ${formatMailTime(input.expiresAt)}. If you did not expect this, ignore this message.`,
  ]);
}

/** An invitation to an address that already signs in: no link, since one person has one account. */
export function invitationForExistingAccountMail(input: { companyName?: string | null }): MailContent {
  const company = input.companyName ? stripControlCharacters(input.companyName) : '';
  const joining = company ? `${company} on Cellwarden` : 'Cellwarden';
  return compose(`Your invitation to ${joining}`, [
    `Someone invited this address to join ${joining}, but it already has a Cellwarden sign-in.`,
    'Sign in as usual; if you forgot your password, use "Forgot password" on the sign-in page.',
    'If you did not expect this, ignore this message.',
  ]);
}

/** A password reset link. */
export function passwordResetMail(input: { link: string; expiresAt: number }): MailContent {
  return compose('Reset your Cellwarden password', [
    'Someone asked to reset the password of your Cellwarden sign-in.',
    'Open this link to choose a new password:',
    safeLink(input.link),
    `The link works once, until ${formatMailTime(input.expiresAt)}.`,
    'If you did not ask for this, ignore this message: your password stays as it is.',
  ]);
}

/** A flag has started on a system. */
export function flagStartedMail(notice: FlagNotice): MailContent {
  const { system, title, when, value, advice } = cleanNotice(notice);
  return compose(`${system}: ${title}`, [
    `${title} on ${system} since ${when}.`,
    `Value: ${value}.`,
    `What to do: ${advice}`,
  ]);
}

/** A flag has cleared on a system. */
export function flagClearedMail(notice: FlagNotice): MailContent {
  const { system, title, when, value, advice } = cleanNotice(notice);
  return compose(`${system}: cleared - ${title}`, [
    `${title} on ${system} cleared at ${when}.`,
    `Value when it cleared: ${value}.`,
    `What to do: ${advice}`,
  ]);
}

/** The commissioning record of a system, sent to its owner with the PDF attached. */
export function commissioningRecordMail(input: {
  systemName: string;
  installerName: string;
  companyName: string;
  recordedAt: number;
  timeZone?: string;
}): MailContent {
  const system = stripControlCharacters(input.systemName);
  const installer = stripControlCharacters(input.installerName);
  const company = stripControlCharacters(input.companyName);
  return compose(`Commissioning record for ${system}`, [
    `Attached is the commissioning record of ${system}, by ${installer} (${company}), ${formatMailTime(input.recordedAt, input.timeZone)}.`,
    'It lists the checks made and their results. It is not a certificate of compliance.',
  ]);
}

function cleanNotice(notice: FlagNotice) {
  return {
    system: stripControlCharacters(notice.systemName),
    title: stripControlCharacters(notice.flagTitle),
    when: formatMailTime(notice.at, notice.timeZone),
    value: stripControlCharacters(notice.value),
    advice: stripControlCharacters(notice.advice),
  };
}

function compose(subject: string, lines: string[]): MailContent {
  return { subject: stripControlCharacters(subject), text: [...lines, '', MONITORING_NOTE, ''].join('\n') };
}

// Links are built by the server, but a template must never send anything other than an http(s) URL.
function safeLink(link: string): string {
  const url = new URL(link);
  if (url.protocol !== 'https:' && url.protocol !== 'http:')
    throw new Error(`a mail link must be http(s); got ${url.protocol}`);
  return url.href;
}

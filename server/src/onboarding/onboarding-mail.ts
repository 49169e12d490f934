import { stripControlCharacters } from '../mail/control-characters';
import { MONITORING_NOTE, type MailContent } from '../mail/mail-templates';
import { formatMailTime } from '../mail/mail-time';

// The e-mails of onboarding and support requests. Names come from people's input and are cleaned here.

const compose = (subject: string, lines: string[]): MailContent => ({
  subject: stripControlCharacters(subject),
  text: [...lines, '', MONITORING_NOTE, ''].join('\n'),
});

function httpLink(link: string): string {
  const url = new URL(link);
  if (url.protocol !== 'https:' && url.protocol !== 'http:')
    throw new Error(`a mail link must be http(s); got ${url.protocol}`);
  return url.href;
}

/** Who set a system up, in words: "Tomas Brandt (Fitters)". */
const byWhom = (installer: string, company: string | null) =>
  company
    ? `${stripControlCharacters(installer)} (${stripControlCharacters(company)})`
    : stripControlCharacters(installer);

/** A system set up for an address without a Cellwarden sign-in: the link creates the account and takes the system. */
export function handoverInvitationMail(input: {
  systemName: string;
  installerName: string;
  companyName: string | null;
  link: string;
  expiresAt: number;
}): MailContent {
  const system = stripControlCharacters(input.systemName);
  return compose(`Your battery system “${system}” on Cellwarden`, [
    `${byWhom(input.installerName, input.companyName)} set up the battery system “${system}” on Cellwarden for you.`,
    'Open this link to choose your name and password; the system is yours as soon as your sign-in exists:',
    httpLink(input.link),
    `The link works until ${formatMailTime(input.expiresAt)}.`,
    "The installer's company keeps its installer rights until you end them on the system's Access page.",
    'If you did not expect this, ignore this message.',
  ]);
}

/** A system set up for an address that already signs in: accept it in the product. */
export function handoverToAccountMail(input: {
  systemName: string;
  installerName: string;
  companyName: string | null;
  link: string;
}): MailContent {
  const system = stripControlCharacters(input.systemName);
  return compose(`Your battery system “${system}” on Cellwarden`, [
    `${byWhom(input.installerName, input.companyName)} set up the battery system “${system}” on Cellwarden for you.`,
    'Sign in as usual and accept it under Requests:',
    httpLink(input.link),
    "The installer's company keeps its installer rights until you end them on the system's Access page.",
    'If you did not expect this, ignore this message.',
  ]);
}

/** A support person asks the owner for access to one system. */
export function accessRequestMail(input: {
  systemName: string;
  requesterName: string;
  requesterEmail: string;
  companyName: string | null;
  note: string;
  link: string;
  expiresAt: number;
}): MailContent {
  const system = stripControlCharacters(input.systemName);
  const who = `${byWhom(input.requesterName, input.companyName)} <${stripControlCharacters(input.requesterEmail)}>`;
  return compose(`Access request for “${system}”`, [
    `${who} asks to see your battery system “${system}”.`,
    ...(input.note ? [`Their note: ${stripControlCharacters(input.note)}`] : []),
    'Approve with view or configure rights and an end date, or decline, under Requests:',
    httpLink(input.link),
    `The request lapses at ${formatMailTime(input.expiresAt)} if you do nothing. Nobody sees the system until you approve.`,
  ]);
}

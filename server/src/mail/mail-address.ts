import { invalidInput } from '../errors/app-error';
import { hasControlCharacters, stripControlCharacters } from './control-characters';

/** A mailbox as nodemailer takes it: the display name is already one clean line. */
export interface MailAddress {
  name: string;
  address: string;
}

// One plain addr-spec (RFC 5322 §3.4.1, dot-atom forms only): no quotes, comments, angle brackets,
// commas or spaces, so a value can never name a second recipient or open a new header.
const PLAIN_ADDRESS =
  /^[A-Za-z0-9!#$%&'*+/=?^_`{|}~-]+(\.[A-Za-z0-9!#$%&'*+/=?^_`{|}~-]+)*@[A-Za-z0-9-]+(\.[A-Za-z0-9-]+)+$/;
// RFC 5321 §4.5.3.1.3: a path is at most 256 octets, so an address is at most 254.
const MAX_ADDRESS_LENGTH = 254;

/** The address itself if it is one plain mailbox, else an AppError naming `field`. */
export function parsePlainAddress(value: unknown, field: string): string {
  const text = typeof value === 'string' ? value : '';
  if (hasControlCharacters(text) || text.length > MAX_ADDRESS_LENGTH || !PLAIN_ADDRESS.test(text)) {
    throw invalidInput(field, `${field} must be one plain e-mail address; got ${JSON.stringify(value)}`);
  }
  return text;
}

/** Reads "Name <address>" or a bare address (the configured sender); the name loses control characters. */
export function parseMailbox(value: string, field: string): MailAddress {
  const match = /^([^<>]*)<([^<>]+)>$/.exec(value.trim());
  if (!match) return { name: '', address: parsePlainAddress(value.trim(), field) };
  const name = stripControlCharacters(match[1]).replace(/^"(.*)"$/, '$1');
  return { name, address: parsePlainAddress(match[2].trim(), field) };
}

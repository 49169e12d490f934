import type { ParsedMail } from 'mailparser';
import type { SMTPServerAddress } from 'smtp-server';

/** One message the mail catcher received, as the development outbox shows it (no attachment bodies). */
export interface CapturedMail {
  id: string;
  /** The envelope recipients: who the message was actually delivered to. */
  to: string[];
  from: string;
  subject: string;
  text: string;
  receivedAt: number;
  attachments: { filename: string; contentType: string; size: number }[];
  /** Lower-case names of the message's header fields, so a test can see that no header was injected. */
  headerNames: string[];
}

/** Reduces a parsed message and its envelope to what the outbox shows. */
export function toCapturedMail(
  id: string,
  parsed: ParsedMail,
  rcptTo: SMTPServerAddress[],
  receivedAt: number,
): CapturedMail {
  return {
    id,
    to: rcptTo.map((recipient) => recipient.address),
    from: parsed.from?.text ?? '',
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    receivedAt,
    attachments: parsed.attachments.map((attachment) => ({
      filename: attachment.filename ?? '',
      contentType: attachment.contentType,
      size: attachment.size,
    })),
    headerNames: parsed.headerLines.map((line) => line.key),
  };
}

import { randomUUID } from 'node:crypto';
import { EventEmitter } from 'node:events';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import type { Logger } from '../logger';
import { toCapturedMail, type CapturedMail } from './captured-mail';

/** Where the catcher listens and how much it keeps. */
export interface MailCatcherOptions {
  /** Loopback only: 127.0.0.1, ::1 or localhost. */
  host: string;
  /** 0 takes a free port. */
  port: number;
  /** Most messages kept; older ones are dropped. */
  limit: number;
  /** Largest message accepted, bytes (default 20 MiB: a 10 MB attachment grows by a third in base64). */
  maxMessageBytes?: number;
  logger?: Logger;
  now?: () => number;
}

/** A local SMTP server that keeps what it receives, for development and tests. */
export interface MailCatcher {
  port: number;
  /** smtp://127.0.0.1:<port>, ready for `createMailer`. */
  url: string;
  /** Newest first. */
  messages(): CapturedMail[];
  /** The first message (already held or still to come) matching `predicate`; rejects after `timeoutMs`. */
  waitFor(predicate: (mail: CapturedMail) => boolean, timeoutMs: number): Promise<CapturedMail>;
  clear(): void;
  stop(): Promise<void>;
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', '::1', 'localhost']);
const DEFAULT_MAX_MESSAGE_BYTES = 20 * 1024 * 1024;

/** Starts a mail catcher: no authentication, no TLS, loopback only, a size limit and a bounded inbox. */
export async function startMailCatcher(options: MailCatcherOptions): Promise<MailCatcher> {
  if (!LOOPBACK_HOSTS.has(options.host))
    throw new Error(`the mail catcher listens on loopback only; got host ${options.host}`);
  const now = options.now ?? Date.now;
  const events = new EventEmitter();
  let inbox: CapturedMail[] = [];
  const keep = (mail: CapturedMail) => {
    inbox = [mail, ...inbox].slice(0, Math.max(1, options.limit));
    events.emit('mail', mail);
  };
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: options.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES,
    logger: false,
    closeTimeout: 1000,
    onConnect: (session, callback) => callback(refuseRemote(session)),
    onData: (stream, session, callback) =>
      receive(stream, session, now, keep).then(() => callback(), callback),
  });
  server.on('error', (error) => options.logger?.warn('mail catcher error', { error: String(error) }));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    messages: () => [...inbox],
    waitFor: (predicate, timeoutMs) => waitForMail(() => inbox, events, predicate, timeoutMs),
    clear: () => {
      inbox = [];
    },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function refuseRemote(session: SMTPServerSession): Error | null {
  const address = session.remoteAddress.replace(/^::ffff:/, '');
  if (address === '127.0.0.1' || address === '::1') return null;
  return Object.assign(new Error('loopback clients only'), { responseCode: 554 });
}

async function receive(
  stream: SMTPServerDataStream,
  session: SMTPServerSession,
  now: () => number,
  keep: (mail: CapturedMail) => void,
): Promise<void> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  // RFC 5321 §4.5.3.1.10 / RFC 1870: 552 when the message exceeds the advertised SIZE.
  if (stream.sizeExceeded) throw Object.assign(new Error('message too large'), { responseCode: 552 });
  const parsed = await simpleParser(Buffer.concat(chunks));
  keep(toCapturedMail(randomUUID(), parsed, session.envelope.rcptTo, now()));
}

function waitForMail(
  inbox: () => CapturedMail[],
  events: EventEmitter,
  predicate: (mail: CapturedMail) => boolean,
  timeoutMs: number,
): Promise<CapturedMail> {
  const held = inbox().find(predicate);
  if (held) return Promise.resolve(held);
  return new Promise((resolve, reject) => {
    const onMail = (mail: CapturedMail) => {
      if (!predicate(mail)) return;
      clearTimeout(timer);
      events.off('mail', onMail);
      resolve(mail);
    };
    const timer = setTimeout(() => {
      events.off('mail', onMail);
      reject(new Error(`no matching mail arrived within ${timeoutMs} ms`));
    }, timeoutMs);
    events.on('mail', onMail);
  });
}

import { randomUUID } from 'node:crypto';
import { invalidInput } from '../errors/app-error';
import { stripControlCharacters } from '../mail/control-characters';

/** Largest upload, bytes (10 MB). */
export const UPLOAD_LIMIT_BYTES = 10 * 1024 * 1024;

/** What an upload is for. */
export type UploadKind = 'photo' | 'log';

/** The content types each kind accepts. */
export const UPLOAD_TYPES: Readonly<Record<UploadKind, readonly string[]>> = {
  photo: ['image/jpeg', 'image/png'],
  log: ['text/plain', 'text/csv'],
};

/** Longest display name kept, characters. */
export const MAX_DISPLAY_NAME_LENGTH = 200;
/** Longest caption accepted, characters. */
export const MAX_CAPTION_LENGTH = 500;

// The stored name's extension comes from the checked type, never from what the user called the file.
const EXTENSIONS: Readonly<Record<string, string>> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'text/plain': 'txt',
  'text/csv': 'csv',
};

/** What the bytes really are, by their first bytes; null for anything we do not accept. */
export type SniffedContent = 'image/jpeg' | 'image/png' | 'text';

const JPEG_MAGIC = Buffer.from([0xff, 0xd8, 0xff]);
const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** Sniffs JPEG (FF D8 FF), PNG (its 8-byte signature) or text (valid UTF-8 without NUL). */
export function sniffContent(content: Buffer): SniffedContent | null {
  if (content.subarray(0, 3).equals(JPEG_MAGIC)) return 'image/jpeg';
  if (content.subarray(0, 8).equals(PNG_MAGIC)) return 'image/png';
  if (content.includes(0)) return null;
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(content);
    return 'text';
  } catch {
    return null;
  }
}

/** A name safe to show: no folders, control characters or leading dots; at most 200 characters. */
export function safeDisplayName(fileName: string): string {
  const base =
    String(fileName ?? '')
      .split(/[/\\]/)
      .pop() ?? '';
  const cleaned = stripControlCharacters(base).replace(/^[.\s]+/, '');
  return Array.from(cleaned).slice(0, MAX_DISPLAY_NAME_LENGTH).join('').trim() || 'upload';
}

/** A fresh stored name: a random UUID and the extension of the checked content type. */
export function newStoredName(contentType: string): string {
  const extension = EXTENSIONS[contentType];
  if (!extension) throw new Error(`no stored extension for ${contentType}`);
  return `${randomUUID()}.${extension}`;
}

/** An upload that passed the policy, ready for `UploadStorage.save`. */
export interface AcceptedUpload {
  kind: UploadKind;
  contentType: string;
  displayName: string;
  caption: string;
  content: Buffer;
}

/** What the route hands over from the multipart request. */
export interface UploadCandidate {
  kind: unknown;
  fileName: string;
  declaredType: string;
  content: Buffer;
  caption?: unknown;
}

/** Checks kind, declared type, real content and caption; refuses with an AppError naming the field. */
export function acceptUpload(candidate: UploadCandidate): AcceptedUpload {
  const kind = parseKind(candidate.kind);
  const declared = String(candidate.declaredType ?? '')
    .split(';')[0]
    .trim()
    .toLowerCase();
  if (!UPLOAD_TYPES[kind].includes(declared))
    throw invalidInput(
      'file',
      `a ${kind} must be ${UPLOAD_TYPES[kind].join(' or ')}; got ${declared || 'no type'}`,
    );
  if (candidate.content.length === 0) throw invalidInput('file', 'the file is empty');
  if (candidate.content.length > UPLOAD_LIMIT_BYTES)
    throw invalidInput('file', `the file must be at most 10 MB; got ${candidate.content.length} bytes`);
  const sniffed = sniffContent(candidate.content);
  const matches = sniffed === declared || (sniffed === 'text' && kind === 'log');
  if (!matches)
    throw invalidInput(
      'file',
      `the file's content is not ${declared}; it looks like ${sniffed ?? 'binary data'}`,
    );
  return {
    kind,
    contentType: declared,
    displayName: safeDisplayName(candidate.fileName),
    caption: parseCaption(candidate.caption),
    content: candidate.content,
  };
}

function parseKind(kind: unknown): UploadKind {
  if (kind === 'photo' || kind === 'log') return kind;
  throw invalidInput('kind', `kind must be photo or log; got ${JSON.stringify(kind ?? null)}`);
}

function parseCaption(caption: unknown): string {
  if (caption === undefined || caption === null) return '';
  if (typeof caption !== 'string') throw invalidInput('caption', 'caption must be text');
  const cleaned = stripControlCharacters(caption);
  if (cleaned.length > MAX_CAPTION_LENGTH)
    throw invalidInput(
      'caption',
      `caption must be at most ${MAX_CAPTION_LENGTH} characters; got ${cleaned.length}`,
    );
  return cleaned;
}

import { AppError } from '../errors/app-error';
import {
  MAX_DISPLAY_NAME_LENGTH,
  UPLOAD_LIMIT_BYTES,
  acceptUpload,
  newStoredName,
  safeDisplayName,
  sniffContent,
} from './upload-policy';

// Magic numbers: JPEG/JFIF SOI marker FF D8 then a marker FF (ITU-T T.81 Annex B); PNG signature
// (W3C PNG spec §5.2); Windows PE files start with "MZ" (Microsoft PE/COFF specification, MS-DOS stub).
const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00]);
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00, 0x00, 0x00, 0x0d]);
const EXE = Buffer.from([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00]);
const CSV = Buffer.from('measuredAt,voltage,current\n2026-12-02T06:00:00Z,13.2,-4.1\n', 'utf8');

function refusal(run: () => unknown): AppError {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    return error as AppError;
  }
  throw new Error('expected a refusal');
}

describe('sniffContent', () => {
  it.each([
    ['a JPEG', JPEG, 'image/jpeg'],
    ['a PNG', PNG, 'image/png'],
    ['UTF-8 text', Buffer.from('Température 25 °C\n', 'utf8'), 'text'],
    ['an executable', EXE, null],
    ['text with a NUL', Buffer.from('abc\u0000def'), null],
    // RFC 3629 §3: 0xC3 must be followed by a continuation byte; 0xFF never appears in UTF-8.
    ['invalid UTF-8', Buffer.from([0x61, 0xc3, 0x28, 0xff]), null],
  ])('recognises %s', (_name, content, expected) => {
    expect(sniffContent(content)).toBe(expected);
  });
});

describe('acceptUpload', () => {
  const photo = { kind: 'photo', fileName: 'fuse.jpg', declaredType: 'image/jpeg', content: JPEG };

  it('accepts a JPEG photo and a CSV log', () => {
    expect(acceptUpload(photo)).toMatchObject({
      kind: 'photo',
      contentType: 'image/jpeg',
      displayName: 'fuse.jpg',
    });
    const log = acceptUpload({ kind: 'log', fileName: 'log.csv', declaredType: 'text/csv', content: CSV });
    expect(log.contentType).toBe('text/csv');
    expect(log.content.equals(CSV)).toBe(true);
  });

  it('refuses text declared as a PNG', () => {
    const error = refusal(() => acceptUpload({ ...photo, declaredType: 'image/png', content: CSV }));
    expect(error.field).toBe('file');
    expect(error.message).toContain('looks like text');
  });

  it('refuses an executable renamed .jpg and declared as a JPEG', () => {
    const error = refusal(() => acceptUpload({ ...photo, fileName: 'holiday.jpg', content: EXE }));
    expect(error.field).toBe('file');
    expect(error.message).toContain('binary data');
  });

  it('refuses an executable sent as a text log', () => {
    const error = refusal(() =>
      acceptUpload({ kind: 'log', fileName: 'a.txt', declaredType: 'text/plain', content: EXE }),
    );
    expect(error.field).toBe('file');
  });

  it('refuses a type the kind does not take, an unknown kind, an empty file and a long caption', () => {
    expect(refusal(() => acceptUpload({ ...photo, declaredType: 'image/gif' })).field).toBe('file');
    expect(refusal(() => acceptUpload({ ...photo, kind: 'video' })).field).toBe('kind');
    expect(refusal(() => acceptUpload({ ...photo, content: Buffer.alloc(0) })).field).toBe('file');
    expect(refusal(() => acceptUpload({ ...photo, caption: 'x'.repeat(501) })).field).toBe('caption');
  });

  it('keeps the limit at 10 MB (10 × 1024 × 1024 bytes, as the brief sets it)', () => {
    expect(UPLOAD_LIMIT_BYTES).toBe(10_485_760);
  });
});

describe('safeDisplayName', () => {
  it.each([
    ['../../etc/passwd', 'passwd'],
    ['C:\\Users\\sam\\photo.jpg', 'photo.jpg'],
    ['.htaccess', 'htaccess'],
    ['...', 'upload'],
    ['shunt\r\nwiring.png', 'shunt wiring.png'],
    ['invoice\u202egpj.exe', 'invoice gpj.exe'],
  ])('turns %j into %j', (name, expected) => {
    expect(safeDisplayName(name)).toBe(expected);
  });

  it('keeps at most 200 characters', () => {
    expect(Array.from(safeDisplayName('é'.repeat(500))).length).toBe(MAX_DISPLAY_NAME_LENGTH);
  });
});

describe('newStoredName', () => {
  it('is a random UUID with the extension of the checked type, never the user name', () => {
    const name = newStoredName('image/png');
    // RFC 9562 §5.4: a version-4 UUID has 4 as its 13th hex digit and 8, 9, a or b as its 17th.
    expect(name).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}\.png$/);
    expect(newStoredName('image/png')).not.toBe(name);
  });
});

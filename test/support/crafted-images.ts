import { crc32, deflateSync } from 'node:zlib';

// Hand-made PNG files for the upload tests, built from the W3C PNG specification (2nd ed.): the 8-byte
// signature (§5.2), then chunks of length, type, data and CRC-32 (§5.3); IHDR (§11.2.2), IDAT, tEXt
// (§11.3.4.3), IEND. Made here rather than committed, so each case says exactly what its bytes are.

const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** Colour types of §11.2.2 used here: 0 greyscale (1 byte a pixel), 6 RGBA (4 bytes a pixel). */
type ColourType = 0 | 6;
const BYTES_PER_PIXEL: Record<ColourType, number> = { 0: 1, 6: 4 };

function chunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

function header(width: number, height: number, colour: ColourType): Buffer {
  const data = Buffer.alloc(13);
  data.writeUInt32BE(width, 0);
  data.writeUInt32BE(height, 4);
  data.set([8, colour, 0, 0, 0], 8); // 8 bits per sample, deflate, adaptive filtering, no interlace
  return chunk('IHDR', data);
}

/** A valid signature and header, then image data that is not deflate at all. RGBA, so a decoder must inflate it. */
export function pngWithJunkData(width = 64, height = 64): Buffer {
  return Buffer.concat([
    SIGNATURE,
    header(width, height, 6),
    chunk('IDAT', Buffer.from('these bytes are not a deflate stream; '.repeat(24))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/**
 * A real, all-black PNG: every row is filter byte 0 and zero samples, which deflate shrinks about a
 * thousandfold, so a few tens of kB decode to tens of megapixels (a decompression bomb when large).
 * `comment` adds a tEXt chunk, metadata a re-encoded copy must not carry.
 */
export function blackPng(width: number, height: number, colour: ColourType = 0, comment?: string): Buffer {
  const raw = Buffer.alloc((1 + width * BYTES_PER_PIXEL[colour]) * height);
  const text = comment ? [chunk('tEXt', Buffer.from(`Comment\0${comment}`, 'latin1'))] : [];
  return Buffer.concat([
    SIGNATURE,
    header(width, height, colour),
    ...text,
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Width and height from a PNG's IHDR (bytes 16–23). */
export function pngSize(png: Buffer): { width: number; height: number } {
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

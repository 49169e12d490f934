import sharp from 'sharp';
import { AppError } from '../errors/app-error';

/** Most pixels a photo may decode to (50 megapixels: an 8,000 × 6,000 phone photo fits). */
export const MAX_PHOTO_PIXELS = 50_000_000;
/** Longest side a photo may have, pixels (a 12,000 × 3,000 panorama fits). */
export const MAX_PHOTO_SIDE = 12_000;
/** Longest side of the copy that is stored, pixels: plenty for a page, a fraction of the bytes. */
export const STORED_PHOTO_SIDE = 2048;
/** Longest side of a photo as the commissioning record embeds it, pixels. */
export const RECORD_PHOTO_SIDE = 1600;

// libvips keeps a cache of decoded images and runs several threads per image; an upload server needs
// neither: one thread per image leaves the other core to the API, and nothing decoded outlives its request.
sharp.cache(false);
sharp.concurrency(1);

/** A photo that decoded cleanly, re-encoded without its metadata. */
export interface DecodedPhoto {
  content: Buffer;
  contentType: 'image/jpeg' | 'image/png';
  width: number;
  height: number;
}

/**
 * Decodes every pixel of an uploaded JPEG or PNG (so junk behind a valid signature is found now, not when
 * a PDF is drawn), refuses decompression bombs from the header before decoding, and returns a re-encoded
 * copy: EXIF orientation applied, at most 2,048 px a side, no metadata (EXIF, GPS, ICC, comments).
 */
export async function decodePhoto(
  content: Buffer,
  declared: 'image/jpeg' | 'image/png',
): Promise<DecodedPhoto> {
  const { width, height } = await readDimensions(content);
  const pipeline = decoder(content)
    .rotate()
    .resize({ width: STORED_PHOTO_SIDE, height: STORED_PHOTO_SIDE, fit: 'inside', withoutEnlargement: true });
  const encoded =
    declared === 'image/png' ? pipeline.png({ compressionLevel: 6 }) : pipeline.jpeg({ quality: 85 });
  const { data, info } = await encoded.toBuffer({ resolveWithObject: true }).catch((error: unknown) => {
    throw undecodable(error);
  });
  if (info.width * info.height === 0) throw undecodable(new Error(`decoded to ${width} × ${height}`));
  return { content: data, contentType: declared, width: info.width, height: info.height };
}

/**
 * A stored photo as the commissioning record embeds it: decoded again (files stored before photos were
 * checked may be anything), at most 1,600 px a side, flattened onto white and encoded as JPEG, which the
 * PDF library copies without decoding. Null when the file does not decode within the limits.
 */
export async function photoForRecord(data: Buffer): Promise<Buffer | null> {
  try {
    await readDimensions(data);
    return await decoder(data)
      .rotate()
      .resize({
        width: RECORD_PHOTO_SIDE,
        height: RECORD_PHOTO_SIDE,
        fit: 'inside',
        withoutEnlargement: true,
      })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 80 })
      .toBuffer();
  } catch {
    return null;
  }
}

// failOn 'warning': a truncated or damaged file is refused rather than decoded half grey; limitInputPixels
// holds even when the header lies about the size.
function decoder(content: Buffer) {
  return sharp(content, { failOn: 'warning', limitInputPixels: MAX_PHOTO_PIXELS, sequentialRead: true });
}

async function readDimensions(content: Buffer): Promise<{ width: number; height: number }> {
  // The header alone: a few tens of kB may claim a billion pixels, which must be refused before decoding.
  const metadata = await sharp(content, { limitInputPixels: false })
    .metadata()
    .catch((error: unknown) => {
      throw undecodable(error);
    });
  const width = metadata.autoOrient?.width ?? metadata.width ?? 0;
  const height = metadata.autoOrient?.height ?? metadata.height ?? 0;
  if (metadata.format !== 'jpeg' && metadata.format !== 'png')
    throw undecodable(new Error(`format ${metadata.format}`));
  if (width > MAX_PHOTO_SIDE || height > MAX_PHOTO_SIDE || width * height > MAX_PHOTO_PIXELS)
    throw new AppError(
      'photo_too_large',
      422,
      `the photo must be at most ${MAX_PHOTO_PIXELS / 1_000_000} megapixels and ${MAX_PHOTO_SIDE.toLocaleString('en')} px a side; got ${width} × ${height} px`,
      'file',
    );
  return { width, height };
}

function undecodable(cause: unknown): AppError {
  if (cause instanceof AppError) return cause;
  return new AppError(
    'photo_not_decodable',
    400,
    'the photo could not be decoded as a whole JPEG or PNG image; export it again from the camera or phone',
    'file',
    { cause },
  );
}

import { stripControlCharacters } from '../mail/control-characters';
import type { CommissioningRecordPhoto } from './commissioning-record-input';
import { contentBottom, contentWidth, heading } from './record-layout';

// pdfkit's openImage is public but missing from @types/pdfkit.
type ImageOpener = { openImage(data: Buffer): { width: number; height: number } };

// A photo has its page: up to about two thirds of an A4 page's height, leaving room for its caption.
const MAX_PHOTO_HEIGHT = 520;

/** Each photo on its own page, scaled to fit, with its caption; one that cannot be read is listed, not fatal. */
export function writePhotos(doc: PDFKit.PDFDocument, photos: CommissioningRecordPhoto[]): void {
  photos.forEach((photo, index) => {
    doc.addPage();
    if (index === 0) heading(doc, 'Photos');
    writePhoto(doc, photo, index + 1);
  });
}

function writePhoto(doc: PDFKit.PDFDocument, photo: CommissioningRecordPhoto, number: number): void {
  const caption = `Photo ${number}: ${stripControlCharacters(photo.caption) || 'no caption'}`;
  const image = photo.data && openImage(doc, photo.data);
  if (!image) return void doc.text(`${caption} (the image could not be read and is left out)`);
  const scale = Math.min(contentWidth(doc) / image.width, MAX_PHOTO_HEIGHT / image.height);
  const width = image.width * scale;
  const height = image.height * scale;
  if (doc.y + height + 2 * doc.currentLineHeight(true) > contentBottom(doc)) doc.addPage();
  const top = doc.y;
  doc.image(image as unknown as PDFKit.Mixins.ImageSrc, doc.page.margins.left, top, { width, height });
  doc.y = top + height + 4;
  doc.text(caption);
  doc.moveDown(0.5);
}

function openImage(doc: PDFKit.PDFDocument, data: Buffer): { width: number; height: number } | null {
  try {
    // Photos arrive as JPEG re-encoded by photoForRecord, whose bytes pdfkit copies without decoding; its
    // own PNG decoding would run in a zlib callback, where a throw escapes every handler.
    const image = (doc as unknown as ImageOpener).openImage(data);
    return image.width > 0 && image.height > 0 ? image : null;
  } catch {
    return null;
  }
}

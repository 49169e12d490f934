import PDFDocument from 'pdfkit';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { RECORD_TITLE, writeCautions, writeChecks, writeHeader, writeSystem } from './record-sections';
import { writePhotos } from './record-photos';
import { writeCircuits, writeComponents } from './record-register';
import { writeSignatures } from './record-signatures';

/** Rendering switches; the defaults are what users download. */
export interface RecordRenderOptions {
  /** Deflate page content (default true); false keeps content streams readable when debugging. */
  compress?: boolean;
}

/** Renders a commissioning record as an A4 PDF in the built-in Helvetica. */
export function renderCommissioningRecord(
  record: CommissioningRecordInput,
  options: RecordRenderOptions = {},
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    bufferPages: true,
    compress: options.compress ?? true,
    info: { Title: RECORD_TITLE, Creator: 'Cellwarden', CreationDate: new Date(record.recordedAt) },
  });
  const done = collect(doc);
  // Cover, register, checks, cautions and signatures; photos last, each on its own page.
  writeHeader(doc, record);
  writeSystem(doc, record);
  if (record.components !== undefined || record.circuits !== undefined) {
    doc.addPage();
    writeComponents(doc, record.components ?? []);
    writeCircuits(doc, record.circuits ?? []);
  }
  doc.addPage();
  writeChecks(doc, record.checks, record.timeZone);
  writeCautions(doc);
  writeSignatures(doc, record);
  writePhotos(doc, record.photos);
  numberPages(doc);
  doc.end();
  return done;
}

/** "Page n of m" at the foot of every buffered page. */
export function numberPages(doc: PDFKit.PDFDocument): void {
  const { start, count } = doc.bufferedPageRange();
  for (let index = start; index < start + count; index++) {
    doc.switchToPage(index);
    const bottom = doc.page.margins.bottom;
    // Writing inside the bottom margin would otherwise make pdfkit start a new page.
    doc.page.margins.bottom = 0;
    doc
      .font('Helvetica')
      .fontSize(9)
      .text(`Page ${index - start + 1} of ${count}`, doc.page.margins.left, doc.page.height - 35, {
        width: doc.page.width - doc.page.margins.left - doc.page.margins.right,
        align: 'center',
        lineBreak: false,
      });
    doc.page.margins.bottom = bottom;
  }
}

/** The document's bytes once it has ended. */
export function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

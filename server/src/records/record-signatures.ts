import { stripControlCharacters } from '../mail/control-characters';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { contentBottom, contentWidth, heading } from './record-layout';

/** Signature and date lines for the installer and the owner, kept together on one page. */
export function writeSignatures(doc: PDFKit.PDFDocument, record: CommissioningRecordInput): void {
  if (doc.y + 190 > contentBottom(doc)) doc.addPage();
  heading(doc, 'Signatures');
  doc.text(
    'Signed by the installer who did the work and by the owner who received the system and this record.',
  );
  const owner = record.owner ? stripControlCharacters(record.owner.name) : '';
  const installer = `${stripControlCharacters(record.installer.name)}, ${stripControlCharacters(record.installer.company)}`;
  signatureBlock(doc, 'Installer', installer);
  signatureBlock(doc, 'Owner', owner);
}

function signatureBlock(doc: PDFKit.PDFDocument, role: string, name: string): void {
  doc.moveDown(1.2).font('Helvetica-Bold').text(`${role}: `, { continued: true });
  doc.font('Helvetica').text(name || '(name)');
  const left = doc.page.margins.left;
  const width = contentWidth(doc);
  const y = doc.y + 30;
  doc
    .moveTo(left, y)
    .lineTo(left + width * 0.6, y)
    .lineWidth(0.6)
    .strokeColor('#333333')
    .stroke();
  doc
    .moveTo(left + width * 0.68, y)
    .lineTo(left + width, y)
    .stroke();
  doc.fontSize(8).text('Signature', left, y + 3, { lineBreak: false });
  doc.text('Date', left + width * 0.68, y + 3, { lineBreak: false });
  doc.fontSize(10);
  doc.x = left;
  doc.y = y + 14;
}

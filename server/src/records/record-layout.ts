// Small drawing steps shared by the record's sections, so every section looks the same.

/** Body text size, points. */
export const BODY_SIZE = 10;

/** A section heading with some space above it. */
export function heading(doc: PDFKit.PDFDocument, text: string): void {
  doc.moveDown(0.8).font('Helvetica-Bold').fontSize(13).text(text).font('Helvetica').fontSize(BODY_SIZE);
  doc.moveDown(0.2);
}

/** "Label: value" on one line, the label in bold. */
export function field(doc: PDFKit.PDFDocument, label: string, value: string): void {
  doc.font('Helvetica-Bold').text(`${label}: `, { continued: true }).font('Helvetica').text(value);
}

/** An indented bullet list. */
export function bullets(doc: PDFKit.PDFDocument, items: readonly string[]): void {
  for (const item of items) doc.text(`-  ${item}`, { indent: 12 });
}

/** A measurement with its unit, or "not measured". */
export function measured(value: number | null, unit: string, digits = 1): string {
  return value === null || !Number.isFinite(value) ? 'not measured' : `${value.toFixed(digits)} ${unit}`;
}

/** Width between the margins. */
export function contentWidth(doc: PDFKit.PDFDocument): number {
  return doc.page.width - doc.page.margins.left - doc.page.margins.right;
}

/** The y below which nothing but the page number goes. */
export function contentBottom(doc: PDFKit.PDFDocument): number {
  return doc.page.height - doc.page.margins.bottom;
}

// The install register in the record: the components fitted and the circuit table with each verdict and the
// rule it rests on, drawn as a table that carries its header onto each new page.
import { stripControlCharacters } from '../mail/control-characters';
import type { RecordCircuit, RecordComponent } from './commissioning-record-input';
import { bullets, contentBottom, heading } from './record-layout';

const COLUMNS: { title: string; width: number; cell: (c: RecordCircuit) => string }[] = [
  { title: 'Circuit', width: 78, cell: (c) => c.name },
  { title: 'Feeds', width: 62, cell: (c) => c.feeds },
  { title: 'Conductor', width: 72, cell: (c) => c.conductor },
  { title: 'Protection', width: 62, cell: (c) => c.protection },
  { title: 'Fuse from battery', width: 46, cell: (c) => c.fuseDistance },
  { title: 'Verdict', width: 36, cell: (c) => c.verdict },
  { title: 'Why, and the rule', width: 139, cell: (c) => `${c.summary}. Rule: ${c.rule}` },
];
const CELL_SIZE = 7.5;
const PAD = 2;

/** The components, by kind, with their ratings in words. */
export function writeComponents(doc: PDFKit.PDFDocument, components: readonly RecordComponent[]): void {
  heading(doc, 'Components');
  if (components.length === 0) return void doc.text('No components are in the install register.');
  bullets(
    doc,
    components.map((c) => clean(`${c.name} (${c.kind}): ${c.ratings}`)),
  );
}

/** The circuit table: conductor, protection, fuse distance, verdict and cited rule for each circuit. */
export function writeCircuits(doc: PDFKit.PDFDocument, circuits: readonly RecordCircuit[]): void {
  heading(doc, 'Circuits');
  if (circuits.length === 0) return void doc.text('No circuits are in the install register.');
  doc.fontSize(CELL_SIZE);
  row(
    doc,
    COLUMNS.map((c) => c.title),
    true,
  );
  for (const circuit of circuits) {
    const cells = COLUMNS.map((c) => clean(c.cell(circuit)));
    if (doc.y + rowHeight(doc, cells) > contentBottom(doc)) {
      doc.addPage();
      row(
        doc,
        COLUMNS.map((c) => c.title),
        true,
      );
    }
    row(doc, cells, false);
  }
  doc.fontSize(10).font('Helvetica');
  doc.x = doc.page.margins.left;
}

function rowHeight(doc: PDFKit.PDFDocument, cells: string[]): number {
  return (
    Math.max(...cells.map((text, i) => doc.heightOfString(text, { width: COLUMNS[i].width - 2 * PAD }))) +
    2 * PAD
  );
}

function row(doc: PDFKit.PDFDocument, cells: string[], header: boolean): void {
  doc.font(header ? 'Helvetica-Bold' : 'Helvetica');
  const top = doc.y;
  const height = rowHeight(doc, cells);
  let x = doc.page.margins.left;
  cells.forEach((text, i) => {
    const width = COLUMNS[i].width;
    if (header) doc.save().rect(x, top, width, height).fillColor('#ecebe6').fill().restore();
    doc.rect(x, top, width, height).lineWidth(0.4).strokeColor('#999999').stroke();
    const failed = !header && COLUMNS[i].title === 'Verdict' && text === 'FAIL';
    doc.font(header || failed ? 'Helvetica-Bold' : 'Helvetica').fillColor('#111111');
    doc.text(text, x + PAD, top + PAD, { width: width - 2 * PAD });
    x += width;
  });
  doc.y = top + height;
}

function clean(text: string): string {
  return stripControlCharacters(String(text ?? ''));
}

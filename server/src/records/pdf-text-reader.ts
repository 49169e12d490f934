import { inflateSync } from 'node:zlib';

// A small reader for the PDFs pdfkit writes with its standard fonts (for specs and integration tests):
// content streams hold text as `[<hex> kerning <hex> ...] TJ` in WinAnsiEncoding (ISO 32000-1 §9.4.3,
// Annex D.2). It is not a general PDF parser.

const STREAM = /<<((?:(?!>>)[^])*)>>\s*stream\r?\n/g;
const TEXT_ARRAY = /\[((?:<[0-9A-Fa-f\s]*>|[^\]<])*)\]\s*TJ|<([0-9A-Fa-f\s]*)>\s*Tj/g;
const WIN_ANSI = new TextDecoder('windows-1252');

/** The text shown by a pdfkit-made PDF, fragments joined by single spaces. */
export function extractPdfText(pdf: Buffer): string {
  const fragments: string[] = [];
  for (const content of contentStreams(pdf)) {
    for (const match of content.matchAll(TEXT_ARRAY)) {
      const hex =
        match[1] !== undefined ? [...match[1].matchAll(/<([0-9A-Fa-f\s]*)>/g)].map((m) => m[1]) : [match[2]];
      fragments.push(WIN_ANSI.decode(Buffer.from(hex.join('').replace(/\s/g, ''), 'hex')));
    }
  }
  return fragments.join(' ').replace(/\s+/g, ' ').trim();
}

/** The number of pages, from the page tree's /Count. */
export function countPdfPages(pdf: Buffer): number {
  const match = /\/Type\s*\/Pages[^]*?\/Count\s+(\d+)/.exec(pdf.toString('latin1'));
  return match ? Number(match[1]) : 0;
}

function* contentStreams(pdf: Buffer): Generator<string> {
  const source = pdf.toString('latin1');
  for (const match of source.matchAll(STREAM)) {
    const dictionary = match[1];
    if (/\/Subtype\s*\/Image/.test(dictionary)) continue;
    const length = Number(/\/Length\s+(\d+)(?!\s+\d+\s+R)/.exec(dictionary)?.[1] ?? NaN);
    if (!Number.isFinite(length)) continue;
    const start = match.index! + match[0].length;
    const bytes = pdf.subarray(start, start + length);
    if (!/\/FlateDecode/.test(dictionary)) {
      yield bytes.toString('latin1');
      continue;
    }
    try {
      yield inflateSync(bytes).toString('latin1');
    } catch {
      // Not a content stream we can read (fonts, metadata); skip it.
    }
  }
}

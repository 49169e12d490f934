// Renders one page of a PDF to a PNG with pdf.js (Mozilla's PDF renderer, plain JavaScript) drawing on
// @napi-rs/canvas (Skia, shipped as a prebuilt npm package: nothing downloaded at install, no browser).
// A plain Node ES module run as a child process, because pdf.js ships only as ES modules.
// Usage: node test/support/render-pdf-page.mjs <in.pdf> <page> <out.png> [scale]
import { readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { createCanvas } from '@napi-rs/canvas';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

const [input, pageNumber, output, scale = '1.5'] = process.argv.slice(2);
const fonts = join(
  dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')),
  'standard_fonts/',
);
const pdf = await getDocument({
  data: new Uint8Array(readFileSync(input)),
  standardFontDataUrl: fonts,
  verbosity: 0,
}).promise;
const page = await pdf.getPage(Number(pageNumber));
const viewport = page.getViewport({ scale: Number(scale) });
const canvas = createCanvas(Math.ceil(viewport.width), Math.ceil(viewport.height));
await page.render({ canvasContext: canvas.getContext('2d'), viewport, canvas }).promise;
writeFileSync(output, canvas.toBuffer('image/png'));
process.stdout.write(JSON.stringify({ pages: pdf.numPages, width: canvas.width, height: canvas.height }));

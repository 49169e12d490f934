// Runs inside the record-rendering worker thread: renders the record it was given and posts the PDF back.
// Whatever pdfkit throws, synchronously or from a callback, ends this thread only, never the server.
import { parentPort, workerData } from 'node:worker_threads';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { renderCommissioningRecord } from './commissioning-record';

const input = workerData as CommissioningRecordInput;
// Structured cloning turns each Buffer into a plain Uint8Array; pdfkit wants Buffers.
input.photos = input.photos.map((photo) => ({
  caption: photo.caption,
  data: photo.data && Buffer.from(photo.data.buffer, photo.data.byteOffset, photo.data.byteLength),
}));
renderCommissioningRecord(input).then((pdf) => {
  const bytes = new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength).slice();
  parentPort!.postMessage(bytes, [bytes.buffer]);
});

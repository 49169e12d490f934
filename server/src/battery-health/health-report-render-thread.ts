// Runs inside a health-report worker thread: renders the report it was given and posts the PDF back.
// Whatever pdfkit throws ends this thread only, never the server.
import { parentPort, workerData } from 'node:worker_threads';
import type { HealthReportInput } from './health-report-input';
import { renderHealthReport } from './health-report-pdf';

renderHealthReport(workerData as HealthReportInput).then((pdf) => {
  const bytes = new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength).slice();
  parentPort!.postMessage(bytes, [bytes.buffer]);
});

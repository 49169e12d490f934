import path from 'node:path';
import { createIsolatedPdfRenderer, type RecordRenderLimits } from '../records/isolated-record-renderer';
import type { HealthReportInput } from './health-report-input';

/** Renders a health report to PDF bytes in a worker thread with the commissioning record's bounds. */
export interface HealthReportRenderer {
  render(report: HealthReportInput): Promise<Buffer>;
}

/** The same heap, time and queue bounds as the commissioning record (stated in DEVELOPERS.md). */
export function createHealthReportRenderer(limits: RecordRenderLimits = {}): HealthReportRenderer {
  return createIsolatedPdfRenderer<HealthReportInput>(
    path.join(__dirname, 'health-report-render-worker.cjs'),
    'battery health report',
    limits,
  );
}

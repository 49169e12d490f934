import { stripControlCharacters } from '../mail/control-characters';
import { formatMailTime } from '../mail/mail-time';
import type { CommissioningRecordCheck, CommissioningRecordInput } from './commissioning-record-input';
import { RECORD_CAUTIONS } from './record-cautions';
import { drawCheckChart } from './record-check-chart';
import { bullets, field, heading, measured } from './record-layout';

/** The title printed at the top of every record. */
export const RECORD_TITLE = 'Cellwarden commissioning record';

const CHEMISTRY_NAMES = { lifepo4: 'LiFePO4', agm: 'AGM lead-acid', flooded: 'Flooded lead-acid' } as const;
const KIND_NAMES = { van: 'Van', cabin: 'Cabin', boat: 'Boat' } as const;

/** The cover's head: title, system, owner, installer and company, date, and the zone the times are in. */
export function writeHeader(doc: PDFKit.PDFDocument, record: CommissioningRecordInput): void {
  doc.font('Helvetica-Bold').fontSize(18).text(RECORD_TITLE).fontSize(10).font('Helvetica');
  doc.moveDown(0.5);
  field(doc, 'System', clean(record.system.name));
  if (record.owner) field(doc, 'Owner', `${clean(record.owner.name)} <${clean(record.owner.email)}>`);
  field(doc, 'Installer', `${clean(record.installer.name)}, ${clean(record.installer.company)}`);
  if (record.installer.company) field(doc, 'Installer company', clean(record.installer.company));
  field(doc, 'Date', formatMailTime(record.recordedAt, record.timeZone));
  field(doc, 'Time zone', `${clean(record.timeZone ?? 'UTC')} (every time in this record is in it)`);
}

/** The battery, its BMS and the charge sources as configured. */
export function writeSystem(doc: PDFKit.PDFDocument, record: CommissioningRecordInput): void {
  const { kind, battery, bms, chargeSources } = record.system;
  heading(doc, 'System');
  field(doc, 'Kind', KIND_NAMES[kind] ?? clean(String(kind)));
  field(
    doc,
    'Battery',
    `${CHEMISTRY_NAMES[battery.chemistry] ?? clean(String(battery.chemistry))}, ${battery.nominalVoltage} V nominal, ` +
      `${battery.ratedCapacityAh} Ah rated, ${battery.usableCapacityAh} Ah usable`,
  );
  field(doc, 'BMS continuous discharge', `${bms.continuousDischargeA} A`);
  if (chargeSources.length === 0) return void field(doc, 'Charge sources', 'none recorded');
  doc.font('Helvetica-Bold').text('Charge sources:').font('Helvetica');
  bullets(
    doc,
    chargeSources.map((s) => `${clean(s.label || s.id)} (${s.kind}), rated ${s.ratedCurrentA} A`),
  );
}

/** Every check with its measurements, verdict and reasons; says so when there are none. */
export function writeChecks(
  doc: PDFKit.PDFDocument,
  checks: CommissioningRecordCheck[],
  timeZone?: string,
): void {
  heading(doc, 'Checks');
  if (checks.length === 0) return void doc.text('No checks were recorded for this system.');
  checks.forEach((check, index) => writeCheck(doc, check, index + 1, timeZone));
}

function writeCheck(
  doc: PDFKit.PDFDocument,
  check: CommissioningRecordCheck,
  number: number,
  timeZone: string | undefined,
): void {
  doc
    .moveDown(0.4)
    .font('Helvetica-Bold')
    .text(`${number}. ${clean(check.source)}: ${check.verdict}`);
  doc.font('Helvetica');
  field(
    doc,
    'Settings',
    `${check.ratedCurrentA} A, tolerance ±${check.tolerancePercent} %, watched for ${check.windowSeconds} s`,
  );
  field(
    doc,
    'Current',
    `mean ${measured(check.meanCurrentA, 'A')}, min ${measured(check.minCurrentA, 'A')}, ` +
      `max ${measured(check.maxCurrentA, 'A')}, ripple ${measured(check.ripplePeakToPeakA, 'A')} peak to peak`,
  );
  field(doc, 'Battery voltage reached', measured(check.batteryVoltageReached, 'V', 2));
  field(doc, 'Cable drop', measured(check.cableDropV, 'V', 2));
  if (check.startedAt !== undefined)
    field(
      doc,
      'Time',
      `${formatMailTime(check.startedAt, timeZone)} to ${check.finishedAt ? formatMailTime(check.finishedAt, timeZone) : 'not finished'}`,
    );
  field(doc, 'Verdict', check.verdict);
  if (check.reasons.length > 0) bullets(doc, check.reasons.map(clean));
  if (check.chart) drawCheckChart(doc, check.chart, check.ratedCurrentA);
}

/** The safety cautions. */
export function writeCautions(doc: PDFKit.PDFDocument): void {
  heading(doc, 'Safety cautions');
  bullets(doc, RECORD_CAUTIONS);
}

function clean(text: string): string {
  return stripControlCharacters(String(text ?? ''));
}

import { stringify } from 'csv-stringify/sync';
import { neutraliseSpreadsheetFormula } from '../uploads/spreadsheet-formula';
import { HEALTH_DISCLAIMERS } from './health-method';
import type { HealthReportInput } from './health-report-input';
import { bandName, CHEMISTRY_NAMES, localTime, temperatureText } from './health-report-text';

/** Columns of the health report CSV: one tidy table, each row a section, a quantity and its value. */
export const HEALTH_CSV_HEADER = [
  'section',
  'quantity',
  'value',
  'band',
  'unit',
  'start_local',
  'end_local',
  'start_utc',
  'end_utc',
  'note',
] as const;

type Row = Partial<Record<(typeof HEALTH_CSV_HEADER)[number], string | number | undefined>>;

const utc = (at: number) => new Date(at).toISOString();
const round = (value: number, digits: number) => Number(value.toFixed(digits));

/** The report as CSV text (a few hundred rows at most: months, samples, bands and episodes). */
export function healthReportCsv(report: HealthReportInput): string {
  const zone = report.timeZone;
  const at = (from: number, to?: number): Row => ({
    start_local: localTime(from, zone),
    end_local: to === undefined ? undefined : localTime(to, zone),
    start_utc: utc(from),
    end_utc: to === undefined ? undefined : utc(to),
  });
  const rows: Row[] = [
    { section: 'report', quantity: 'system', note: report.system.name },
    {
      section: 'report',
      quantity: 'chemistry',
      note: CHEMISTRY_NAMES[report.system.chemistry] ?? report.system.chemistry,
    },
    { section: 'report', quantity: 'nominal voltage', value: report.system.nominalVoltage, unit: 'V' },
    { section: 'report', quantity: 'rated capacity', value: report.system.ratedCapacityAh, unit: 'Ah' },
    {
      section: 'report',
      quantity: 'rated usable capacity',
      value: report.system.usableCapacityAh,
      unit: 'Ah',
    },
    { section: 'report', quantity: 'time zone of local times', note: zone },
    { section: 'report', quantity: 'period asked for', ...at(report.requested.from, report.requested.to) },
    report.covered
      ? { section: 'report', quantity: 'data in the period', ...at(report.covered.from, report.covered.to) }
      : { section: 'report', quantity: 'data in the period', note: 'none' },
    { section: 'report', quantity: 'made', ...at(report.madeAt) },
    ...report.words.map((words) => ({ section: 'summary', quantity: 'in words', note: words })),
  ];
  const now = report.trend.current;
  if (now) {
    rows.push(
      {
        section: 'capacity',
        quantity: 'usable capacity',
        value: round(now.usableAh, 2),
        band: round(now.sigmaAh, 2),
        unit: 'Ah',
        ...at(now.asOf),
        note: 'band is one standard deviation',
      },
      {
        section: 'capacity',
        quantity: 'state of health',
        value: round(now.stateOfHealth * 100, 1),
        band: round(now.sigmaStateOfHealth * 100, 1),
        unit: '%',
      },
    );
  }
  for (const m of report.trend.months)
    rows.push({
      section: 'capacity month',
      quantity: 'usable capacity',
      value: round(m.usableAh, 2),
      band: round(m.sigmaAh, 2),
      unit: 'Ah',
      ...at(m.monthStart),
      note: `${m.samples} estimates`,
    });
  for (const s of report.samples)
    rows.push({
      section: 'capacity estimate',
      quantity: 'usable capacity',
      value: round(s.usableAh, 2),
      band: round(s.sigmaAh, 2),
      unit: 'Ah',
      ...at(s.fullAt, s.at),
      note: `${s.method}; ${round(s.countedAh, 1)} Ah counted; ${temperatureText(s.temperature, report.unit)}`,
    });
  const f = report.figures;
  rows.push(
    { section: 'use', quantity: 'hours with data', value: f.hoursCovered, unit: 'h' },
    { section: 'use', quantity: 'equivalent full cycles', value: round(f.equivalentFullCycles, 2) },
    { section: 'use', quantity: 'charge in', value: round(f.ahIn, 1), unit: 'Ah' },
    { section: 'use', quantity: 'charge out', value: round(f.ahOut, 1), unit: 'Ah' },
    { section: 'use', quantity: 'energy in', value: round(f.whIn, 0), unit: 'Wh' },
    { section: 'use', quantity: 'energy out', value: round(f.whOut, 0), unit: 'Wh' },
    {
      section: 'use',
      quantity: 'round-trip efficiency',
      value: f.chargeEfficiency === undefined ? undefined : round(f.chargeEfficiency * 100, 1),
      unit: '%',
      note: f.chargeEfficiency === undefined ? 'not yet known' : undefined,
    },
    {
      section: 'use',
      quantity: 'hours hot at high charge',
      value: round(f.hotAtHighChargeHours, 0),
      unit: 'h',
      note: `${temperatureText(35, report.unit, 0)} or more at 90 % charge or more`,
    },
    ...f.temperatureHours.map((t) => ({
      section: 'temperature',
      quantity: bandName(t.band, report.unit),
      value: round(t.hours, 0),
      unit: 'h',
    })),
    ...f.depthOfDischarge.map((d) => ({
      section: 'depth of discharge',
      quantity: `${d.fromPercent}-${d.toPercent} %`,
      value: round(d.cycles, 2),
      unit: 'cycles',
    })),
    ...f.coldCharging.map((e) => ({
      section: 'cold charging',
      quantity: 'charge in',
      value: round(e.ahIn, 2),
      unit: 'Ah',
      ...at(e.start, e.end),
      note: `pack ${temperatureText(e.lowestTemperature, report.unit)} to ${temperatureText(e.highestTemperature, report.unit)}`,
    })),
    ...f.hotCharging.map((e) => ({
      section: 'hot charging',
      quantity: 'charge in',
      value: round(e.ahIn, 2),
      unit: 'Ah',
      ...at(e.start, e.end),
      note: `pack ${temperatureText(e.lowestTemperature, report.unit)} to ${temperatureText(e.highestTemperature, report.unit)}`,
    })),
    { section: 'method', quantity: 'method', note: report.method },
    ...HEALTH_DISCLAIMERS.map((note) => ({ section: 'disclaimer', quantity: 'disclaimer', note })),
  );
  const records = rows.map((row) =>
    HEALTH_CSV_HEADER.map((column) =>
      neutraliseSpreadsheetFormula(row[column] === undefined ? '' : String(row[column])),
    ),
  );
  return stringify([[...HEALTH_CSV_HEADER], ...records]);
}

// Readings as CSV rows, one format for export and import: a header naming each column with its unit,
// ISO 8601 times with a zone, plain decimal numbers. Parsing the CSV text itself is the caller's (RFC 4180).
import type { BatteryReading } from './reading';
import { TelemetryInputError } from './telemetry-input-error';
import { validateReading } from './reading-validation';

/** The columns, in order; the last two may be empty. */
export const READINGS_CSV_HEADER = [
  'measured_at',
  'voltage_v',
  'current_a',
  'temperature_c',
  'state_of_charge_pct',
  'power_w',
] as const;

const REQUIRED = 4;
// A plain decimal: no exponent, no hex, no leading "+", "=" or "@" (so nothing a spreadsheet runs as a formula).
const DECIMAL = /^-?\d{1,7}(\.\d{1,9})?$/;
const ISO_WITH_ZONE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,6})?)?(Z|[+-]\d{2}:\d{2})$/;

/** A CSV row that cannot be a reading: which line and which column. */
export class ReadingsCsvError extends TelemetryInputError {
  constructor(
    readonly line: number,
    field: string,
    message: string,
  ) {
    super('invalid_csv', `line ${line}: ${message}`, { field });
    this.name = 'ReadingsCsvError';
  }
}

const COLUMN_OF: Record<string, string> = {
  measuredAt: 'measured_at',
  voltage: 'voltage_v',
  current: 'current_a',
  temperature: 'temperature_c',
  stateOfCharge: 'state_of_charge_pct',
  power: 'power_w',
};

const formatNumber = (value: number | undefined) =>
  value === undefined ? '' : String(Number(value.toFixed(4)));

/** One reading as a CSV record (strings, in header order). */
export function readingToCsvRecord(reading: BatteryReading): string[] {
  return [
    new Date(reading.measuredAt).toISOString(),
    formatNumber(reading.voltage),
    formatNumber(reading.current),
    formatNumber(reading.temperature),
    formatNumber(reading.stateOfCharge),
    formatNumber(reading.power),
  ];
}

/** Checks that a CSV header is ours, so columns are never guessed. */
export function checkReadingsCsvHeader(header: readonly string[]): void {
  const names = header.map((h) => h.trim().toLowerCase());
  const expected = READINGS_CSV_HEADER.slice(0, Math.max(REQUIRED, names.length));
  if (names.length < REQUIRED || names.some((name, i) => name !== expected[i]))
    throw new ReadingsCsvError(
      1,
      'header',
      `the header must be ${READINGS_CSV_HEADER.join(',')}; got ${header.join(',').slice(0, 200)}`,
    );
}

function parseNumber(
  line: number,
  field: string,
  text: string | undefined,
  required: boolean,
): number | undefined {
  const value = (text ?? '').trim();
  if (value === '' && !required) return undefined;
  if (!DECIMAL.test(value))
    throw new ReadingsCsvError(
      line,
      field,
      `${field} must be a plain decimal number; got ${JSON.stringify(value.slice(0, 40))}`,
    );
  return Number(value);
}

/** One CSV record (after the header) as a validated reading; `line` is its 1-based line in the file. */
export function csvRecordToReading(record: readonly string[], line: number, now: number): BatteryReading {
  if (record.length > READINGS_CSV_HEADER.length)
    throw new ReadingsCsvError(
      line,
      'row',
      `expected at most ${READINGS_CSV_HEADER.length} columns; got ${record.length}`,
    );
  const time = (record[0] ?? '').trim();
  const measuredAt = ISO_WITH_ZONE.test(time) ? Date.parse(time) : NaN;
  if (!Number.isFinite(measuredAt))
    throw new ReadingsCsvError(
      line,
      'measured_at',
      `measured_at must be an ISO 8601 time with a zone; got ${JSON.stringify(time.slice(0, 40))}`,
    );
  const reading: BatteryReading = {
    measuredAt,
    voltage: parseNumber(line, 'voltage_v', record[1], true)!,
    current: parseNumber(line, 'current_a', record[2], true)!,
    temperature: parseNumber(line, 'temperature_c', record[3], true)!,
  };
  const stateOfCharge = parseNumber(line, 'state_of_charge_pct', record[4], false);
  const power = parseNumber(line, 'power_w', record[5], false);
  if (stateOfCharge !== undefined) reading.stateOfCharge = stateOfCharge;
  if (power !== undefined) reading.power = power;
  try {
    validateReading(reading, { now });
  } catch (error) {
    const field = COLUMN_OF[(error as TelemetryInputError).field ?? ''] ?? 'row';
    throw new ReadingsCsvError(line, field, (error as Error).message);
  }
  return reading;
}

import {
  checkReadingsCsvHeader,
  csvRecordToReading,
  READINGS_CSV_HEADER,
  readingToCsvRecord,
} from './readings-csv';

const NOW = Date.UTC(2026, 11, 2, 12);

describe('readings CSV', () => {
  it('turns a reading into a record and back without loss at four decimals', () => {
    const reading = {
      measuredAt: NOW - 60_000,
      voltage: 13.2512,
      current: -4.1,
      temperature: -3.5,
      stateOfCharge: 71,
      power: -54.33,
    };
    const record = readingToCsvRecord(reading);
    // ISO 8601 / RFC 3339 §5.6: UTC times end in "Z".
    expect(record[0]).toBe('2026-12-02T11:59:00.000Z');
    expect(csvRecordToReading(record, 2, NOW)).toEqual(reading);
  });

  it('leaves the optional columns out of the reading when they are empty', () => {
    const reading = csvRecordToReading(['2026-12-02T10:00:00+01:00', '12.9', '2', '4', '', ''], 5, NOW);
    // RFC 3339 §5.6: +01:00 is one hour ahead of UTC, so 10:00+01:00 is 09:00Z.
    expect(reading).toEqual({
      measuredAt: Date.UTC(2026, 11, 2, 9),
      voltage: 12.9,
      current: 2,
      temperature: 4,
    });
  });

  it('accepts our header, with or without the optional columns, and refuses any other', () => {
    expect(() => checkReadingsCsvHeader([...READINGS_CSV_HEADER])).not.toThrow();
    expect(() => checkReadingsCsvHeader(READINGS_CSV_HEADER.slice(0, 4))).not.toThrow();
    expect(() => checkReadingsCsvHeader(['time', 'volts', 'amps', 'temp'])).toThrow(/header must be/);
  });

  it.each([
    ['a formula in a number', ['2026-12-02T10:00:00Z', '=1+1', '2', '4'], 'voltage_v'],
    ['an exponent', ['2026-12-02T10:00:00Z', '1e3', '2', '4'], 'voltage_v'],
    ['Infinity', ['2026-12-02T10:00:00Z', '13', 'Infinity', '4'], 'current_a'],
    ['a time without a zone', ['2026-12-02 10:00', '13', '2', '4'], 'measured_at'],
    ['an implausible voltage', ['2026-12-02T10:00:00Z', '612', '2', '4'], 'voltage_v'],
    ['a time in the future', ['2027-06-01T10:00:00Z', '13', '2', '4'], 'measured_at'],
    ['too many columns', ['2026-12-02T10:00:00Z', '13', '2', '4', '50', '20', 'x'], 'row'],
  ])('refuses %s, naming the line and the column', (_name, record, field) => {
    expect(() => csvRecordToReading(record, 7, NOW)).toThrow(expect.objectContaining({ line: 7, field }));
  });
});

import { previewReadingsCsv, splitCsvRecords } from './csv-preview';

const HEADER = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';
const NOW = Date.UTC(2026, 11, 3, 12);

describe('splitCsvRecords', () => {
  // RFC 4180 section 2, rules 5-7: quoted fields, doubled quotes, line breaks inside quotes.
  it('reads quoted fields with doubled quotes and line breaks, keeping each record’s first line', () => {
    const text = 'a,b\r\n"x ""y""","two\nlines"\r\nlast,row';
    expect(splitCsvRecords(text, 10)).toEqual([
      { line: 1, fields: ['a', 'b'] },
      { line: 2, fields: ['x "y"', 'two\nlines'] },
      { line: 4, fields: ['last', 'row'] },
    ]);
  });

  it('stops after the asked number of records and skips blank lines and a byte-order mark', () => {
    expect(splitCsvRecords('\uFEFFa\n\nb\nc\nd', 2)).toEqual([
      { line: 1, fields: ['a'] },
      { line: 3, fields: ['b'] },
    ]);
  });
});

describe('previewReadingsCsv', () => {
  it('reads the first rows as readings with the shared rules', () => {
    const preview = previewReadingsCsv(
      `${HEADER}\n2026-12-03T10:00:00.000Z,26.4,-3.2,18.5,55,-84.5\n2026-12-03T10:01:00.000Z,26.3,-3.1,18.4,,\n`,
      5,
      NOW,
    );
    expect(preview.headerProblem).toBeNull();
    expect(preview.rows).toEqual([
      {
        line: 2,
        reading: {
          measuredAt: Date.UTC(2026, 11, 3, 10),
          voltage: 26.4,
          current: -3.2,
          temperature: 18.5,
          stateOfCharge: 55,
          power: -84.5,
        },
      },
      {
        line: 3,
        reading: {
          measuredAt: Date.UTC(2026, 11, 3, 10, 1),
          voltage: 26.3,
          current: -3.1,
          temperature: 18.4,
        },
      },
    ]);
  });

  it('names the line and column of a row the server would refuse', () => {
    const preview = previewReadingsCsv(`${HEADER}\n2026-12-03T10:00:00Z,=2+5,-3.2,18.5`, 5, NOW);
    expect(preview.rows).toEqual([
      { line: 2, column: 'voltage_v', problem: expect.stringMatching(/^voltage_v must be a plain decimal/) },
    ]);
  });

  it('refuses a foreign header before reading any row', () => {
    const preview = previewReadingsCsv('time,volts\n2026-01-01T00:00:00Z,12', 5, NOW);
    expect(preview.headerProblem).toMatch(/^line 1: the header must be measured_at,voltage_v/);
    expect(preview.rows).toEqual([]);
  });

  it('says an empty file is empty', () =>
    expect(previewReadingsCsv('', 5, NOW).headerProblem).toBe('The file is empty.'));
});

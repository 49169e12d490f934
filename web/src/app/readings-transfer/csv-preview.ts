// The import's preview, in the browser, with the same header check and row rules as the server
// (shared/src/telemetry/readings-csv.ts); the server's csv-parse stays the authority on the whole file.
import {
  type BatteryReading,
  ReadingsCsvError,
  checkReadingsCsvHeader,
  csvRecordToReading,
} from '@cellwarden/shared';

/** One previewed row: its line in the file and the reading, or what is wrong with it. */
export type PreviewRow =
  { line: number; reading: BatteryReading } | { line: number; column: string; problem: string };

/** The first rows of a file, or why its header is not a readings header. */
export interface CsvPreview {
  headerProblem: string | null;
  rows: PreviewRow[];
}

/**
 * Splits the start of a CSV text into records with their first line (RFC 4180 section 2: fields may be
 * quoted, a quote inside a quoted field is doubled, quoted fields may hold line breaks). Only for the preview:
 * a record cut off by `limit` is simply not returned.
 */
export function splitCsvRecords(text: string, limit: number): { line: number; fields: string[] }[] {
  const records: { line: number; fields: string[] }[] = [];
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let recordLine = 1;
  const endRecord = () => {
    fields.push(field);
    if (fields.length > 1 || fields[0].trim() !== '') records.push({ line: recordLine, fields });
    fields = [];
    field = '';
  };
  const body = text.startsWith('\uFEFF') ? text.slice(1) : text;
  for (let i = 0; i < body.length && records.length < limit; i++) {
    const char = body[i];
    if (quoted && char === '"' && body[i + 1] === '"') {
      field += '"';
      i++;
    } else if (quoted && char === '"') {
      quoted = false;
    } else if (quoted) {
      if (char === '\n') line++;
      field += char;
    } else if (char === '"' && field === '') {
      quoted = true;
    } else if (char === ',') {
      fields.push(field);
      field = '';
    } else if (char === '\r' || char === '\n') {
      if (char === '\r' && body[i + 1] === '\n') i++;
      endRecord();
      line++;
      recordLine = line;
    } else {
      field += char;
    }
  }
  if (records.length < limit && !quoted && (field !== '' || fields.length > 0)) endRecord();
  return records;
}

/** The header check and the first `rowCount` rows of a readings CSV, each read as the server would. */
export function previewReadingsCsv(text: string, rowCount: number, now: number): CsvPreview {
  const [header, ...rows] = splitCsvRecords(text, rowCount + 1);
  if (!header) return { headerProblem: 'The file is empty.', rows: [] };
  try {
    checkReadingsCsvHeader(header.fields);
  } catch (error) {
    return { headerProblem: (error as Error).message, rows: [] };
  }
  return {
    headerProblem: null,
    rows: rows.map(({ line, fields }): PreviewRow => {
      try {
        return { line, reading: csvRecordToReading(fields, line, now) };
      } catch (error) {
        if (!(error instanceof ReadingsCsvError)) throw error;
        return { line, column: error.field ?? 'row', problem: error.message.replace(/^line \d+: /, '') };
      }
    }),
  };
}

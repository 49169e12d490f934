import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { setImmediate as nextTurn } from 'node:timers/promises';
import { CsvError, parse, type Info } from 'csv-parse';
import {
  checkReadingsCsvHeader,
  csvRecordToReading,
  ReadingsCsvError,
  type BatteryReading,
} from '@cellwarden/shared';
import { AppError, invalidInput } from '../errors/app-error';

/** Largest CSV import, bytes (16 MiB). */
export const IMPORT_LIMIT_BYTES = 16 * 1024 * 1024;
/** Most rows one import may hold (a year at one reading a minute is 525,600; a week at 1 Hz 604,800). */
export const MAX_IMPORT_ROWS = 200_000;
/** Longest the reader works before letting other requests run, ms. */
export const IMPORT_SLICE_MS = 20;

/** Bounds of one read; the defaults are the import route's. */
export interface ReadingsCsvLimits {
  maxBytes?: number;
  maxRows?: number;
  sliceMs?: number;
}

/**
 * Reads a readings CSV from a stream: counted bytes (refused past the cap as they arrive, not after),
 * parsed by csv-parse's stream parser (RFC 4180) and validated row by row, giving the event loop back
 * every `sliceMs` so a 16 MB file never holds up other requests for more than a few tens of ms. Nothing
 * is stored here: the caller inserts only when every row was valid. Throws AppError naming line and column.
 */
export async function readReadingsCsv(
  source: Readable,
  now: number,
  limits: ReadingsCsvLimits = {},
): Promise<BatteryReading[]> {
  const maxBytes = limits.maxBytes ?? IMPORT_LIMIT_BYTES;
  const maxRows = limits.maxRows ?? MAX_IMPORT_ROWS;
  const sliceMs = limits.sliceMs ?? IMPORT_SLICE_MS;
  let bytes = 0;
  const byteCap = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      bytes += chunk.length;
      done(bytes > maxBytes ? fileTooLarge(maxBytes) : null, chunk);
    },
  });
  const parser = parse({
    relax_column_count: true,
    skip_empty_lines: true,
    bom: true,
    max_record_size: 4096,
    info: true,
  });
  const readings: BatteryReading[] = [];
  let headerSeen = false;
  // The source is piped, not put in the pipeline: a refusal must not destroy the request (and with it
  // the socket the answer goes back on); the caller decides what to do with the unread rest.
  source.pipe(byteCap);
  const onSourceError = (error: Error) => byteCap.destroy(error);
  const onSourceClose = () => {
    if (!source.readableEnded)
      byteCap.destroy(
        Object.assign(new Error('the upload ended early'), { code: 'ERR_STREAM_PREMATURE_CLOSE' }),
      );
  };
  source.once('error', onSourceError);
  source.once('close', onSourceClose);
  try {
    await pipeline(byteCap, parser, async (rows: AsyncIterable<{ record: string[]; info: Info }>) => {
      let sliceStart = performance.now();
      for await (const { record, info } of rows) {
        if (!headerSeen) {
          checkReadingsCsvHeader(record);
          headerSeen = true;
        } else {
          if (readings.length >= maxRows)
            throw invalidInput('file', `at most ${maxRows} rows per import; the file has more`);
          readings.push(csvRecordToReading(record, firstLine(record, info), now));
        }
        if (performance.now() - sliceStart >= sliceMs) {
          await nextTurn();
          sliceStart = performance.now();
        }
      }
    });
  } catch (error) {
    throw asImportError(error);
  } finally {
    source.unpipe(byteCap);
    source.off('error', onSourceError);
    source.off('close', onSourceClose);
  }
  if (!headerSeen) throw invalidInput('file', 'the file is empty');
  return readings;
}

// csv-parse counts the line a record ends on; a quoted field may span lines, and people look for the first.
function firstLine(record: readonly string[], info: Info): number {
  const breaks = record.reduce((count, field) => count + (field.match(/\r\n|\r|\n/g)?.length ?? 0), 0);
  return info.lines - breaks;
}

function asImportError(error: unknown): unknown {
  if (error instanceof AppError) return error;
  if (error instanceof ReadingsCsvError) return invalidInput(error.field ?? 'file', error.message);
  if (error instanceof CsvError)
    return invalidInput(
      'file',
      `line ${(error as CsvError & { lines?: number }).lines ?? 0}: not valid CSV (${error.message.slice(0, 120)})`,
    );
  // The client went away mid-upload: nothing was stored, and there is nobody left to answer.
  const code = (error as { code?: string })?.code;
  if (code === 'ERR_STREAM_PREMATURE_CLOSE' || code === 'ECONNRESET')
    return new AppError('invalid_input', 400, 'the upload ended before the whole file arrived', 'file', {
      cause: error,
    });
  return error;
}

function fileTooLarge(maxBytes: number): AppError {
  return new AppError(
    'file_too_large',
    413,
    `the file must be at most ${maxBytes / (1024 * 1024)} MB`,
    'file',
  );
}

import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import {
  checkReadingsCsvHeader,
  csvRecordToReading,
  READINGS_CSV_HEADER,
  ReadingsCsvError,
  readingToCsvRecord,
  type BatteryReading,
  type PublicUser,
} from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsRepository } from './readings-repository';

/** Most rows one import may hold (a year at one reading a minute is 525,600). */
export const MAX_IMPORT_ROWS = 200_000;
const EXPORT_CHUNK_MS = 24 * 3600_000;
const IMPORT_DEVICE = 'csv-import';

/** Export of raw readings as CSV, and import of a CSV file that is stored only if every row is valid. */
export function createReadingsCsvService(deps: {
  systems: SystemsService;
  repository: ReadingsRepository;
  audit: AuditService;
  now: () => number;
}) {
  return {
    /** Yields the CSV text in day-sized pieces, so a year is never held in memory at once. */
    async *export(user: PublicUser, systemId: string, from: Date, to: Date): AsyncGenerator<string> {
      const system = await deps.systems.getFor(user, systemId, 'export');
      await deps.audit.record(
        system.id,
        user,
        'readings.exported',
        `${from.toISOString()} – ${to.toISOString()}`,
      );
      yield stringify([[...READINGS_CSV_HEADER]]);
      for (let start = from.getTime(); start < to.getTime(); start += EXPORT_CHUNK_MS) {
        const end = new Date(Math.min(start + EXPORT_CHUNK_MS, to.getTime()));
        const rows = await deps.repository.listRaw(system.id, new Date(start), end);
        if (rows.length > 0) yield stringify(rows.map(readingToCsvRecord));
      }
    },

    async import(user: PublicUser, systemId: string, text: string) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      let records: string[][];
      try {
        records = parse(text, {
          relax_column_count: true,
          skip_empty_lines: true,
          bom: true,
          max_record_size: 4096,
        });
      } catch (error) {
        const line = (error as { lines?: number }).lines ?? 0;
        throw invalidInput('file', `line ${line}: not valid CSV (${(error as Error).message.slice(0, 120)})`);
      }
      if (records.length === 0) throw invalidInput('file', 'the file is empty');
      if (records.length - 1 > MAX_IMPORT_ROWS)
        throw invalidInput('file', `at most ${MAX_IMPORT_ROWS} rows per import; got ${records.length - 1}`);
      const now = deps.now();
      let readings: BatteryReading[];
      try {
        checkReadingsCsvHeader(records[0]);
        readings = records.slice(1).map((record, i) => csvRecordToReading(record, i + 2, now));
      } catch (error) {
        if (error instanceof ReadingsCsvError) throw invalidInput(error.field ?? 'file', error.message);
        throw error;
      }
      let stored = 0;
      for (let i = 0; i < readings.length; i += 1000) {
        const batch = readings
          .slice(i, i + 1000)
          .map((reading) => ({ systemId: system.id, deviceId: IMPORT_DEVICE, reading }));
        stored += (await deps.repository.insertBatch(batch)).length;
      }
      await deps.audit.record(system.id, user, 'system.changed', `imported ${stored} readings from CSV`);
      return { rows: readings.length, stored, duplicates: readings.length - stored };
    },
  };
}

export type ReadingsCsvService = ReturnType<typeof createReadingsCsvService>;

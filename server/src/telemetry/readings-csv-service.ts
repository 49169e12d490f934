import type { Readable } from 'node:stream';
import { stringify } from 'csv-stringify/sync';
import { READINGS_CSV_HEADER, readingToCsvRecord, type PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import type { SystemsService } from '../systems/systems-service';
import { readReadingsCsv } from './readings-csv-reader';
import type { ReadingsRepository } from './readings-repository';

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

    /** Stores the readings of a CSV stream only if every row is valid (checked before the first insert). */
    async import(user: PublicUser, systemId: string, csv: Readable) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const readings = await readReadingsCsv(csv, deps.now());
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

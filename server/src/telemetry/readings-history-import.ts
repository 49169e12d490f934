import type { Sequelize } from 'sequelize';
import { createReadingsRepository, type ReadingRow } from './readings-repository';

/**
 * Taking in readings made elsewhere (the demo's simulated history and its silent monitor): stored through the
 * same insert as live ingest, so the rollups are built as they would have been. No access check: only the
 * seeders call it, before anyone is signed in.
 */
export function createReadingsHistoryImport(sequelize: Sequelize) {
  const repository = createReadingsRepository(sequelize);
  return {
    /** How many readings the system has stored already (a seeder leaves a system with history alone). */
    countForSystem: (systemId: string): Promise<number> => repository.countForSystem(systemId),

    /** Stores one batch (a reading already stored is skipped); answers the rows newly stored. */
    store: (rows: readonly ReadingRow[]): Promise<ReadingRow[]> => repository.insertBatch(rows),
  };
}

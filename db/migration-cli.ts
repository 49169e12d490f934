import type { Sequelize } from 'sequelize';
import { loadDatabaseConfig } from '../server/src/config';
import { connectDatabase } from '../server/src/database/connect-database';
import { createMigrator } from './migrator';

const USAGE = `usage: npm run db -- <command>
  up        apply every pending migration
  down      revert the most recent migration
  pending   list the migrations not yet applied
The database is DATABASE_URL, the same setting the server reads.`;

/** What the CLI needs from its surroundings; tests pass their own. */
export interface MigrationCliDeps {
  env: Record<string, string | undefined>;
  print: (line: string) => void;
  connect?: (url: string) => Sequelize;
}

/** `npm run db -- up|down|pending`: runs one migrator command; returns the exit code (2 for bad usage). */
export async function runMigrationCli(args: string[], deps: MigrationCliDeps): Promise<number> {
  const [command, ...rest] = args;
  if (!['up', 'down', 'pending'].includes(command ?? '') || rest.length > 0) {
    deps.print(command === undefined ? USAGE : `unknown arguments: ${args.join(' ')}\n${USAGE}`);
    return 2;
  }
  let url: string;
  try {
    url = loadDatabaseConfig(deps.env).DATABASE_URL;
  } catch (error) {
    deps.print((error as Error).message);
    return 2;
  }
  const sequelize = (deps.connect ?? connectDatabase)(url);
  try {
    const migrator = createMigrator(sequelize);
    if (command === 'pending') {
      const pending = await migrator.pending();
      deps.print(pending.length === 0 ? 'No pending migrations.' : pending.map((m) => m.name).join('\n'));
    } else if (command === 'up') {
      const applied = await migrator.up();
      deps.print(
        applied.length === 0 ? 'Already up to date.' : `Applied: ${applied.map((m) => m.name).join(', ')}`,
      );
    } else {
      const reverted = await migrator.down();
      deps.print(
        reverted.length === 0 ? 'Nothing to revert.' : `Reverted: ${reverted.map((m) => m.name).join(', ')}`,
      );
    }
    return 0;
  } finally {
    await sequelize.close();
  }
}

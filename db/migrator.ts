import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from './migrations';

/** The one migrator: main, tests and the start script all run the schema through it. */
export function createMigrator(sequelize: Sequelize, log: (message: string) => void = () => undefined) {
  return new Umzug({
    migrations: migrations.map(({ name, up, down }) => ({
      name,
      up: () => up(sequelize),
      down: () => down(sequelize),
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: {
      info: (event) => log(JSON.stringify(event)),
      warn: (event) => log(JSON.stringify(event)),
      error: (event) => log(JSON.stringify(event)),
      debug: () => undefined,
    },
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrateToLatest(
  sequelize: Sequelize,
  log?: (message: string) => void,
): Promise<string[]> {
  const applied = await createMigrator(sequelize, log).up();
  return applied.map((m) => m.name);
}

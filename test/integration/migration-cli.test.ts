import { QueryTypes } from 'sequelize';
import { migrations } from '../../db/migrations';
import { runMigrationCli } from '../../db/migration-cli';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createTestDatabase } from '../support/test-database';

// `npm run db -- up|down|pending` against a real PostgreSQL database of its own.
describe('migration CLI', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  beforeAll(async () => {
    database = await createTestDatabase();
  });
  afterAll(() => database.drop());

  const run = async (command: string) => {
    const lines: string[] = [];
    const code = await runMigrationCli([command], {
      env: { DATABASE_URL: database.url },
      print: (line) => lines.push(line),
    });
    return { code, output: lines.join('\n') };
  };
  const applied = async () => {
    const sequelize = connectDatabase(database.url);
    try {
      const rows = await sequelize.query<{ name: string }>(
        'SELECT name FROM schema_migrations ORDER BY name',
        {
          type: QueryTypes.SELECT,
        },
      );
      return rows.map((r) => r.name);
    } finally {
      await sequelize.close();
    }
  };
  const last = migrations[migrations.length - 1].name;

  it('applies what is pending, reverts the latest and applies it again', async () => {
    expect((await run('up')).code).toBe(0);
    expect(await run('pending')).toEqual({ code: 0, output: 'No pending migrations.' });
    expect(await applied()).toEqual(migrations.map((m) => m.name));

    expect(await run('down')).toEqual({ code: 0, output: `Reverted: ${last}` });
    expect(await run('pending')).toEqual({ code: 0, output: last });
    expect(await applied()).not.toContain(last);

    expect(await run('up')).toEqual({ code: 0, output: `Applied: ${last}` });
    expect(await run('up')).toEqual({ code: 0, output: 'Already up to date.' });
  });
});

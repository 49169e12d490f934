import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import { createAnalyticsSettingsLoader } from '../../server/src/alerts/analytics-settings-loader';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createSettingsRepository } from '../../server/src/settings/settings-repository';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { createTestDatabase } from '../support/test-database';

// After a restart the fleet's first readings ask for many systems' analytics settings at once. Against the real
// schema: one settings query and one lead-monitor query answer them all, with what the one-system read gives.

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let sequelize: Sequelize;
let systems: { id: string; name: string; timeZone: string }[];
const queries: string[] = [];

beforeAll(async () => {
  database = await createTestDatabase();
  sequelize = connectDatabase(database.url, (sql) => queries.push(sql));
  await seedDemoScenario(sequelize);
  systems = await sequelize.query(`SELECT id, name, time_zone AS "timeZone" FROM systems ORDER BY id`, {
    type: QueryTypes.SELECT,
  });
});
afterAll(async () => {
  await sequelize.close();
  await database.drop();
});

const loaderWith = (batchLimit?: number) =>
  createAnalyticsSettingsLoader({
    settings: createSettingsRepository(sequelize),
    readings: createReadingsRepository(sequelize),
    now: () => Date.now(),
    batchLimit,
  });

/** The earliest registered monitor still in service, per system (the lead-monitor rule, restated). */
async function earliestMonitors(): Promise<Map<string, string>> {
  const rows = await sequelize.query<{ systemId: string; id: string }>(
    `SELECT system_id AS "systemId", id FROM devices WHERE revoked_at IS NULL ORDER BY created_at DESC, id DESC`,
    { type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.systemId, r.id]));
}

it('answers every system asked for in one turn with one settings query and one lead-monitor query', async () => {
  expect(systems.length).toBeGreaterThan(1);
  const leads = await earliestMonitors();
  const load = loaderWith();
  queries.length = 0;
  const profiles = await Promise.all([
    ...systems.map((s) => load(s.id)),
    load(randomUUID()),
    load('not-a-system-id'),
  ]);
  expect(queries).toHaveLength(2);
  systems.forEach((system, i) =>
    expect(profiles[i]).toMatchObject({
      name: system.name,
      timeZone: system.timeZone,
      leadDeviceId: leads.get(system.id) ?? null,
    }),
  );
  // A system that does not exist, and an id that could name none, are simply not there.
  expect(profiles.slice(systems.length)).toEqual([undefined, undefined]);
});

it('reads the same settings in the batch as the settings API reads one by one', async () => {
  const settings = createSettingsRepository(sequelize);
  const many = await settings.findMany(systems.map((s) => s.id));
  for (const system of systems) expect(many.get(system.id)).toEqual(await settings.find(system.id));
});

it('splits a crowd larger than the batch limit into several queries', async () => {
  const load = loaderWith(1);
  queries.length = 0;
  await Promise.all(systems.map((s) => load(s.id)));
  // One settings and one lead-monitor query per batch of one.
  expect(queries).toHaveLength(2 * systems.length);
});

it('reads a change of settings at the next load', async () => {
  const settings = createSettingsRepository(sequelize);
  const [system] = systems;
  const stored = (await settings.find(system.id))!;
  await settings.update(system.id, { ...stored, name: `${stored.name} (renamed)` });
  expect((await loaderWith()(system.id))?.name).toBe(`${system.name} (renamed)`);
});

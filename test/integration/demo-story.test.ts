import { QueryTypes, type Sequelize } from 'sequelize';
import { connectDatabase } from '../../server/src/database/connect-database';
import { DEMO_FLEET, seedDemoFleet } from '../../db/seeders/demo-fleet';
import { seedDemoHistory } from '../../db/seeders/demo-history';
import { DEMO_DEVICES, seedDemoScenario } from '../../db/seeders/demo-scenario';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { simulateReadings } from '../../simulator/src/simulate-readings';
import { createTestDatabase } from '../support/test-database';

// The demo tells one story: its seeded history is the live simulator's own timeline (no seam where they
// meet), and the installer company has a fleet in varied states.

jest.setTimeout(60000);

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let sequelize: Sequelize;
const now = Date.UTC(2026, 11, 3, 6, 0, 0);

beforeAll(async () => {
  database = await createTestDatabase();
  sequelize = connectDatabase(database.url);
  await seedDemoScenario(sequelize);
});
afterAll(async () => {
  await sequelize.close();
  await database.drop();
});

const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

it('stores history from the same timeline the live simulator resumes, thinned to one reading a minute', async () => {
  const { timeline } = await seedDemoHistory(sequelize, {
    days: 0.1,
    liveIntervalSeconds: 5,
    storedEverySeconds: 60,
    now,
  });
  expect(timeline).toBeDefined();
  const van = DEMO_DEVICES[0];
  const stored = await rows<{ at: number; voltage: number; temperature: number }>(
    `SELECT (extract(epoch FROM measured_at) * 1000)::float8 AS at, voltage, temperature
     FROM readings WHERE device_id = :id ORDER BY measured_at`,
    { id: van.id },
  );
  // What the resumed live simulator computes: the same seed and interval from the same origin.
  const live = simulateReadings(SCENARIOS[van.scenario], {
    seed: timeline!.seeds[van.id],
    start: timeline!.origin,
    intervalSeconds: timeline!.intervalSeconds,
    count: Math.ceil((now - timeline!.origin) / 5000) + 1,
  }).readings;
  const byTime = new Map(live.map((r) => [r.measuredAt, r]));
  expect(stored.length).toBe(Math.ceil((now - timeline!.origin) / 60_000));
  for (const row of stored) {
    expect(row.voltage).toBeCloseTo(byTime.get(row.at)!.voltage, 3);
    expect(row.temperature).toBeCloseTo(byTime.get(row.at)!.temperature, 1);
  }
  // The first live reading after the history follows the last stored one a step later, not from a fresh start.
  const last = stored[stored.length - 1];
  const next = live.find((r) => r.measuredAt > last.at && r.measuredAt >= now)!;
  expect(Math.abs(next.temperature - last.temperature)).toBeLessThan(1);
});

it('gives the installer company a fleet in varied states, one silent for hours and one failed commissioning', async () => {
  expect(await seedDemoFleet(sequelize, 'fleet-secret-for-this-test-only', now)).toBe(true);
  expect(await seedDemoFleet(sequelize, 'fleet-secret-for-this-test-only', now)).toBe(false);
  const [{ n }] = await rows<{ n: string }>(
    `SELECT count(*) AS n FROM systems s JOIN users u ON u.company_id = s.installer_company_id
     WHERE u.email = 'tomas.brandt@fitters.example'`,
  );
  expect(Number(n)).toBeGreaterThanOrEqual(DEMO_FLEET.size + 3);
  const silent = await rows<{ last: number }>(
    `SELECT (extract(epoch FROM max(measured_at)) * 1000)::float8 AS last FROM readings
     WHERE device_id = :id`,
    { id: `${DEMO_FLEET.idPrefix}-${DEMO_FLEET.size + 1}` },
  );
  expect(now - silent[0].last).toBeGreaterThan(4 * 3600_000);
  // Its readings arrived when they were measured, so a node started later finds it quiet for hours.
  const [{ late }] = await rows<{ late: string }>(
    `SELECT count(*) AS late FROM readings WHERE device_id = :id AND received_at <> measured_at`,
    { id: `${DEMO_FLEET.idPrefix}-${DEMO_FLEET.size + 1}` },
  );
  expect(Number(late)).toBe(0);
  const checks = await rows<{ status: string; reasons: string[] }>(
    `SELECT status, result->'reasons' AS reasons FROM commissioning_checks`,
  );
  expect(checks).toHaveLength(1);
  expect(checks[0].status).toBe('failed');
  expect(checks[0].reasons.length).toBeGreaterThan(0);
});

it('gives the cabin two monitors on one bank, the shunt leading and the BMS link beside it', async () => {
  const monitors = await rows<{ id: string; label: string }>(
    `SELECT d.id, d.label FROM devices d JOIN devices lead ON lead.system_id = d.system_id
     WHERE lead.id = 'cw-demo-cabin' AND d.revoked_at IS NULL ORDER BY d.created_at, d.id`,
  );
  expect(monitors).toEqual([
    { id: 'cw-demo-cabin', label: 'Main shunt' },
    { id: 'cw-demo-cabin-bms', label: 'Pack BMS link' },
  ]);
  const second = DEMO_DEVICES.find((d) => d.id === 'cw-demo-cabin-bms')!;
  expect(second.monitorOf).toBe('cw-demo-cabin');
  // Its seeded history is the lead's alone: the second monitor's readings begin when it goes live.
  const [{ n }] = await rows<{ n: string }>(`SELECT count(*) AS n FROM readings WHERE device_id = :id`, {
    id: second.id,
  });
  expect(Number(n)).toBe(0);
});

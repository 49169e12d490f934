import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import {
  createCapacityTracker,
  createLifeCycleAccumulator,
  type BatteryReading,
  type CapacitySample,
} from '@cellwarden/shared';
import { seedDemoBatteryYear } from '../../db/seeders/demo-battery-year';
import { DEMO_DEVICES, DEMO_PASSWORD, DEMO_USERS, seedDemoScenario } from '../../db/seeders/demo-scenario';
import { batterySetupOf, createBatteryHealthJob } from '../../server/src/battery-health/battery-health-job';
import { createBatteryHealthRepository } from '../../server/src/battery-health/battery-health-repository';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createMemoryLogger } from '../../server/src/logger';
import { extractPdfText } from '../../server/src/records/pdf-text-reader';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { yearOfUse } from '../../simulator/src/year-of-use';
import { signInAs } from '../support/http-session';
import { createTestDatabase } from '../support/test-database';
import { startTestServer } from '../support/test-server';

// The battery-health job must give the same figures however its runs fall, and the same as one straight pass
// over the same rollups; the API reads what the job stored, through the access rule, and audits each report.

jest.setTimeout(180_000);

const MINUTE = 60_000;
const DAY = 86_400_000;
const [OWNER, , SUPPORT] = DEMO_USERS;

/** Readings one a minute made from the year generator's minutes (the monitor's own view of them). */
function readingsOf(start: number, days: number): BatteryReading[] {
  const readings: BatteryReading[] = [];
  for (const { minute } of yearOfUse({ seed: 11, start, days, longitude: 23.8 }))
    readings.push({
      measuredAt: minute.start + 30_000,
      voltage: minute.voltageLast,
      current: minute.currentMean,
      temperature: minute.temperatureMean,
      stateOfCharge: minute.socLast,
    });
  return readings;
}

async function systemOf(sequelize: Sequelize, deviceId: string): Promise<string> {
  const [row] = await sequelize.query<{ systemId: string }>(
    'SELECT system_id AS "systemId" FROM devices WHERE id = :deviceId',
    { replacements: { deviceId }, type: QueryTypes.SELECT },
  );
  return row.systemId;
}

describe('the incremental job', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let sequelize: Sequelize;
  let systemId: string;
  const repository = () => createBatteryHealthRepository(sequelize);
  // Small runs, so two "runs" of the job are in fact many passes that each stop mid-stream.
  const job = () =>
    createBatteryHealthJob({
      repository: repository(),
      logger: createMemoryLogger(),
      limits: { minutesPerRun: 3000, hoursPerRun: 50 },
    });
  const store = async (readings: BatteryReading[]) => {
    const writer = createReadingsRepository(sequelize);
    for (let i = 0; i < readings.length; i += 2000)
      await writer.insertBatch(
        readings.slice(i, i + 2000).map((reading) => ({ systemId, deviceId: DEMO_DEVICES[0].id, reading })),
      );
  };
  /** One straight pass, in memory, over every complete rollup stored now. */
  const straight = async () => {
    const system = (await repository().findSystem(systemId))!;
    const tracker = createCapacityTracker(batterySetupOf(system));
    const samples: CapacitySample[] = [];
    for (const minute of await repository().completeMinutes(systemId, null, 1e6)) {
      const sample = tracker.push(minute);
      if (sample) samples.push(sample);
    }
    const accumulator = createLifeCycleAccumulator(system.usableCapacityAh);
    for (const hour of await repository().completeHours(systemId, { from: null }, 1e6))
      accumulator.push(hour);
    return { samples, figures: accumulator.figures() };
  };
  const stored = async () => {
    const checkpoint = (await repository().findCheckpoint(systemId))!;
    return {
      samples: await repository().listSamples(systemId),
      figures: createLifeCycleAccumulator(checkpoint.usableAh, checkpoint.lifecycleState!).figures(),
      checkpoint,
    };
  };

  beforeAll(async () => {
    database = await createTestDatabase();
    sequelize = connectDatabase(database.url);
    await seedDemoScenario(sequelize);
    systemId = await systemOf(sequelize, DEMO_DEVICES[0].id);
  });
  afterAll(async () => {
    await sequelize.close();
    await database.drop();
  });

  it('gives after two runs the figures of one run over the same rollups, and of a straight pass', async () => {
    const start = Math.floor((Date.now() - 22 * DAY) / MINUTE) * MINUTE;
    const readings = readingsOf(start, 21);
    await store(readings.slice(0, 9 * 1440));
    await job().catchUp();
    await store(readings.slice(9 * 1440));
    await job().catchUp();
    const twoRuns = await stored();

    await sequelize.query('DELETE FROM battery_capacity_samples; DELETE FROM battery_health_checkpoints');
    await createBatteryHealthJob({ repository: repository(), logger: createMemoryLogger() }).catchUp();
    const oneRun = await stored();
    const reference = await straight();

    // Three weeks with a full charge each week: the estimator must have measured something to compare.
    expect(reference.samples.length).toBeGreaterThan(0);
    expect(reference.figures.hoursCovered).toBeGreaterThan(20 * 24);
    expect(twoRuns.samples).toEqual(oneRun.samples);
    expect(twoRuns.figures).toEqual(oneRun.figures);
    expect(twoRuns.samples).toEqual(reference.samples);
    expect(twoRuns.figures).toEqual(reference.figures);
    // Only complete buckets are taken: the newest hour is left for the next run.
    const [{ newest }] = await sequelize.query<{ newest: number }>(
      `SELECT (extract(epoch FROM max(bucket_start)) * 1000)::float8 AS newest FROM rollups_1h WHERE system_id = :systemId`,
      { replacements: { systemId }, type: QueryTypes.SELECT },
    );
    expect(twoRuns.checkpoint.hoursThrough).toBe(newest);
  });

  it('counts the life-cycle figures again from the hours when late readings reach hours already counted', async () => {
    const { checkpoint } = await stored();
    const lateAt = checkpoint.hoursThrough! - 5 * 3600_000 + 17_000;
    // A backlog arrives with the device's new readings: the late one and two hours after the newest stored.
    const newest = checkpoint.minutesThrough! + 2 * 3600_000;
    await store([
      { measuredAt: lateAt, voltage: 13.1, current: 40, temperature: 12 },
      { measuredAt: newest, voltage: 13.2, current: 1, temperature: 12 },
      { measuredAt: newest + 3600_000, voltage: 13.2, current: 1, temperature: 12 },
    ]);
    const results = await job().catchUp();
    expect(results.some((r) => r.rebuilt)).toBe(true);
    const after = await stored();
    expect(after.checkpoint.lateRebuilds).toBe(checkpoint.lateRebuilds + 1);
    expect(after.figures).toEqual((await straight()).figures);
    // Nothing new: a further run changes nothing.
    expect((await job().catchUp()).filter((r) => r.rebuilt)).toEqual([]);
  });
});

describe('the battery health API', () => {
  let node: Awaited<ReturnType<typeof startTestServer>>;
  let vanId: string;
  let cabinId: string;
  let owner: string;
  let support: string;

  beforeAll(async () => {
    node = await startTestServer();
    vanId = await systemOf(node.database, DEMO_DEVICES[0].id);
    cabinId = await systemOf(node.database, DEMO_DEVICES[1].id);
    // A shorter year than the demo's keeps the test quick; the path is the same.
    await seedDemoBatteryYear(node.database, { end: Date.now(), days: 90 });
    owner = (await signInAs(node.baseUrl, OWNER.email, DEMO_PASSWORD)).accessToken;
    support = (await signInAs(node.baseUrl, SUPPORT.email, DEMO_PASSWORD)).accessToken;
  });
  afterAll(() => node.stop());

  const get = (path: string, token: string) =>
    request(node.baseUrl).get(path).set('Authorization', `Bearer ${token}`);
  const audit = async (systemId: string) =>
    node.database.query<{ action: string; detail: string }>(
      `SELECT action, detail FROM audit_entries WHERE system_id = :systemId ORDER BY at`,
      { replacements: { systemId }, type: QueryTypes.SELECT },
    );

  it('shows the owner the stored trend, figures, words, method and period, in their locale', async () => {
    const response = await get(`/api/systems/${vanId}/battery-health?locale=en-GB`, owner);
    expect(response.status).toBe(200);
    const body = response.body;
    expect(body).toMatchObject({
      systemId: vanId,
      chemistry: 'lifepo4',
      ratedCapacityAh: 200,
      usableCapacityAh: 190,
      timeZone: 'Europe/Helsinki',
      mayExport: true,
      lateDataNote: null,
    });
    expect(body.period.to - body.period.from).toBeGreaterThanOrEqual(89 * DAY);
    expect(body.figures.hoursCovered).toBeGreaterThan(80 * 24);
    expect(body.sampleCount).toBeGreaterThan(0);
    expect(body.capacity.current.stateOfHealth).toBeGreaterThan(0.8);
    expect(body.words.length).toBeGreaterThan(0);
    expect(body.method).toMatch(/coulomb counting/i);
  });

  it('lets someone with a view grant read it, and tells a stranger nothing', async () => {
    const granted = await get(`/api/systems/${vanId}/battery-health`, support);
    expect(granted.status).toBe(200);
    // The support desk has no grant on the cabin: 404, as for every other route, so its existence is not told.
    expect((await get(`/api/systems/${cabinId}/battery-health`, support)).status).toBe(404);
    const from = new Date(Date.now() - 30 * DAY).toISOString();
    const to = new Date().toISOString();
    const refused = await get(
      `/api/systems/${cabinId}/battery-health/report.pdf?from=${from}&to=${to}`,
      support,
    );
    expect(refused.status).toBe(404);
    expect((await audit(cabinId)).filter((e) => e.detail.includes('battery health'))).toEqual([]);
  });

  it('makes the PDF report with the method, the evidence in the system’s zone and the disclaimer, and audits it', async () => {
    const from = new Date(Date.now() - 91 * DAY).toISOString();
    const to = new Date().toISOString();
    const response = await get(`/api/systems/${vanId}/battery-health/report.pdf?from=${from}&to=${to}`, owner)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    const text = extractPdfText(response.body as Buffer);
    expect(text).toContain('Cellwarden battery health report');
    expect(text).toContain('Winter van');
    expect(text).toMatch(/Usable capacity: \d+\.\d Ah ± \d+\.\d Ah/);
    expect(text).toContain('Europe/Helsinki');
    expect(text).toMatch(/coulomb counting/i);
    expect(text).toContain('not a warranty assessment');
    expect(text).toContain('never replaces the battery management system');
    const entries = await audit(vanId);
    expect(entries.at(-1)).toEqual({
      action: 'readings.exported',
      detail: expect.stringContaining('battery health report (PDF)'),
    });
  });

  it('makes the CSV report for a period, with its rows by section, and audits it', async () => {
    const from = new Date(Date.now() - 60 * DAY).toISOString();
    const to = new Date().toISOString();
    const response = await get(
      `/api/systems/${vanId}/battery-health/report.csv?from=${from}&to=${to}`,
      support,
    );
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/^text\/csv/);
    const lines = response.text.trim().split('\n');
    expect(lines[0]).toBe('section,quantity,value,band,unit,start_local,end_local,start_utc,end_utc,note');
    expect(response.text).toMatch(/^use,equivalent full cycles,\d/m);
    expect(response.text).toMatch(/^temperature,below 0 °C,\d+,,h/m);
    expect(response.text).toMatch(/^disclaimer,disclaimer,.*not a warranty assessment/m);
    expect((await audit(vanId)).at(-1)?.detail).toContain('battery health report (CSV)');
  });

  it.each([
    ['', 'from'],
    ['from=yesterday&to=2026-12-01T00:00:00Z', 'from'],
    ['from=2026-12-01T00:00:00Z', 'to'],
    ['from=2026-12-01T00:00:00Z&to=2026-11-01T00:00:00Z', 'from'],
    ['from=2020-01-01T00:00:00Z&to=2026-11-01T00:00:00Z', 'to'],
    ['from=2026-11-01T00:00:00Z&from=2026-10-01T00:00:00Z&to=2026-12-01T00:00:00Z', 'from'],
    ['from=2026-11-01T00:00:00Z&to=2026-12-01T00:00:00Z&locale=%21%21', 'locale'],
    ['from=2026-11-01T00:00:00Z&to=2026-12-01T00:00:00Z&unit=K', 'unit'],
  ])('answers 400 naming the field for the report query "%s"', async (query, field) => {
    for (const format of ['pdf', 'csv']) {
      const response = await get(`/api/systems/${vanId}/battery-health/report.${format}?${query}`, owner);
      expect(response.status).toBe(400);
      expect(response.body.error.field).toBe(field);
    }
  });

  it('writes the sentences and the report in °F for a reader who asks for it', async () => {
    const words = (await get(`/api/systems/${vanId}/battery-health?locale=en-GB&unit=F`, owner)).body.words;
    // The charging-limit sentences name 0 °C as 32 °F, and no Celsius figure is left.
    expect(words.join(' ')).toMatch(/below 32 °F/);
    expect(words.join(' ')).not.toMatch(/°C/);
    const csv = await get(
      `/api/systems/${vanId}/battery-health/report.csv?from=2025-12-01T00:00:00Z&to=2026-12-01T00:00:00Z&unit=F`,
      owner,
    );
    expect(csv.status).toBe(200);
    // 0 °C is 32 °F (NIST SP 811, §B.8).
    expect(csv.text).toMatch(/^temperature,below 32 °F,\d+,,h/m);
  });

  it('answers 400 naming locale for a bad locale on the screen’s call', async () => {
    const response = await get(`/api/systems/${vanId}/battery-health?locale=${'x'.repeat(40)}`, owner);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe('locale');
  });
});

import { QueryTypes } from 'sequelize';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let token: string;
let cabinId: string;

beforeAll(async () => {
  node = await startTestServer();
  token = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${token}`);
  cabinId = systems.body.systems.find((s: { kind: string }) => s.kind === 'cabin').id;
});
afterAll(() => node.stop());

const count = () => createReadingsRepository(node.database).countForSystem(cabinId);
const importCsv = (text: string) =>
  request(node.baseUrl)
    .post(`/api/systems/${cabinId}/readings/import`)
    .set('Authorization', `Bearer ${token}`)
    .set('Content-Type', 'text/csv')
    .send(text);
const lines = (start: number, n: number) =>
  Array.from(
    { length: n },
    (_, i) => `${new Date(start + i * 60_000).toISOString()},26.4,-3.2,18.5,55,-84.5`,
  );
const HEADER = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';

it('imports a CSV of readings and exports them back, once each', async () => {
  const start = Date.now() - 3 * 3600_000;
  const response = await importCsv([HEADER, ...lines(start, 120)].join('\r\n'));
  expect(response.status).toBe(200);
  expect(response.body.import).toEqual({ rows: 120, stored: 120, duplicates: 0 });
  // The same file again: at-least-once is stored once.
  expect((await importCsv([HEADER, ...lines(start, 120)].join('\n'))).body.import.duplicates).toBe(120);
  expect(await count()).toBe(120);

  const exported = await request(node.baseUrl)
    .get(`/api/systems/${cabinId}/readings.csv`)
    .query({ from: new Date(start - 1000).toISOString(), to: new Date().toISOString() })
    .set('Authorization', `Bearer ${token}`);
  expect(exported.status).toBe(200);
  expect(exported.headers['content-type']).toMatch(/^text\/csv/);
  const rows = exported.text.trim().split('\n');
  expect(rows[0]).toBe(HEADER);
  expect(rows).toHaveLength(121);
  expect(rows[1]).toBe(`${new Date(start).toISOString()},26.4,-3.2,18.5,55,-84.5`);
  // The one minute rollup of the import counted its reading (rollups follow imports as they follow ingest).
  const [rollup] = await node.database.query<{ n: number }>(
    `SELECT sum(reading_count)::int AS n FROM rollups_1m WHERE system_id = :cabinId`,
    { replacements: { cabinId }, type: QueryTypes.SELECT },
  );
  expect(rollup.n).toBe(120);
});

it('stores nothing from a file with one bad row, and says which line and column', async () => {
  const before = await count();
  const good = lines(Date.now() - 10 * 3600_000, 10);
  good[4] = good[4].replace('26.4', '=2+5');
  const response = await importCsv([HEADER, ...good].join('\n'));
  expect(response.status).toBe(400);
  expect(response.body.error.field).toBe('voltage_v');
  expect(response.body.error.message).toMatch(/^line 6:/);
  expect(await count()).toBe(before);
});

it('refuses a foreign header, malformed CSV and an unsupported type with clear errors', async () => {
  const foreign = await importCsv('time,volts\n2026-01-01T00:00:00Z,12');
  expect(foreign.body.error.field).toBe('header');
  const malformed = await importCsv(`${HEADER}\n"unterminated,12,1,1`);
  expect(malformed.status).toBe(400);
  expect(malformed.body.error.field).toBe('file');
  const json = await request(node.baseUrl)
    .post(`/api/systems/${cabinId}/readings/import`)
    .set('Authorization', `Bearer ${token}`)
    .send({ rows: [] });
  expect(json.status).toBe(415);
});

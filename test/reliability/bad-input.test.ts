import fc from 'fast-check';
import { connectAsync, type MqttClient } from 'mqtt';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import {
  encodeReadingPack,
  parseReadingPayload,
  readingsTopic,
  TelemetryInputError,
  validateReading,
} from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';
import { badPayloadCorpus } from './bad-payload-corpus';
import { GARBAGE_ROUTES, garbageBody, pathParameter, RAW_GARBAGE, type GarbageRoute } from './garbage-bodies';

jest.setTimeout(120000);

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let van: MqttClient;
let vanSystemId: string;
const vanDevice = demo.devices.find((d) => d.system === 'van')!;
const tokens: Record<GarbageRoute['as'], string> = { owner: '', admin: '', anonymous: '' };

beforeAll(async () => {
  node = await startTestServer({ env: { SIGN_IN_LIMIT_PER_ADDRESS: '100000', INGEST_RETRY_MS: '10' } });
  tokens.owner = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
  tokens.admin = (await signInAs(node.baseUrl, 'admin@fitters.example', demo.password)).accessToken;
  [{ systemId: vanSystemId }] = await node.database.query<{ systemId: string }>(
    'SELECT system_id AS "systemId" FROM devices WHERE id = :id',
    { replacements: { id: vanDevice.id }, type: QueryTypes.SELECT },
  );
  van = await connectAsync(node.mqttUrl, {
    username: vanDevice.id,
    password: vanDevice.secret,
    clientId: `${vanDevice.id}/bad-input`,
    reconnectPeriod: 0,
  });
});
afterAll(async () => {
  await van.endAsync();
  await node.stop();
});

const refusalTotal = () =>
  Object.values(node.server.ingest.stats().refusals[vanDevice.id] ?? {}).reduce((a, b) => a + b, 0);
const rowCount = async () =>
  Number(
    (
      await node.database.query<{ n: string }>('SELECT count(*) AS n FROM readings WHERE device_id = :id', {
        replacements: { id: vanDevice.id },
        type: QueryTypes.SELECT,
      })
    )[0].n,
  );

/** What the decoder makes of a payload: 'stored' (every reading plausible) or the refusal code; anything else throws. */
function decode(payload: string | Uint8Array): string {
  try {
    const { readings } = parseReadingPayload(payload, { now: Date.now(), expectedDeviceId: vanDevice.id });
    readings.forEach((r) => validateReading(r, { now: Date.now() }));
    return 'stored';
  } catch (error) {
    if (error instanceof TelemetryInputError && /^[a-z0-9_]+$/.test(error.code)) return error.code;
    throw error;
  }
}

it('decodes every hand-picked payload to the intended reading or the intended refusal', () => {
  const corpus = badPayloadCorpus(vanDevice.id, Date.now());
  const outcomes = corpus.map((entry) => ({ name: entry.name, outcome: decode(entry.payload) }));
  expect(outcomes).toEqual(corpus.map((entry) => ({ name: entry.name, outcome: entry.outcome })));
});

it('refuses arbitrary bytes, text and JSON with a stable code, never another error', () => {
  const valid = JSON.stringify(
    encodeReadingPack(vanDevice.id, [
      { measuredAt: Date.now() - 1000, voltage: 13, current: 1, temperature: 9 },
    ]),
  );
  const payloads = fc.oneof(
    fc.uint8Array({ maxLength: 300 }),
    fc.string({ unit: 'binary', maxLength: 300 }),
    fc.jsonValue({ maxDepth: 4 }).map((v) => JSON.stringify(v)),
    fc
      .array(
        fc.dictionary(fc.constantFrom('bn', 'bt', 'n', 'u', 'v', 't', 'vs', 's', 'bver'), fc.jsonValue()),
        {
          maxLength: 6,
        },
      )
      .map((v) => JSON.stringify(v)),
    // A valid pack with a few characters spliced in somewhere: near misses of the real format.
    fc
      .tuple(fc.nat({ max: valid.length }), fc.string({ unit: 'binary', maxLength: 4 }))
      .map(([at, text]) => valid.slice(0, at) + text + valid.slice(at)),
  );
  let refused = 0;
  fc.assert(
    fc.property(payloads, (payload) => {
      if (decode(payload) !== 'stored') refused++;
    }),
    { numRuns: 2000 },
  );
  // The property is that decode never throws anything but a coded TelemetryInputError, and what it keeps is plausible.
  console.log(`bad-input: decoder refused ${refused} of 2000 generated payloads, every one with a code`);
});

it('stores or refuses each payload over MQTT exactly as intended, and keeps serving', async () => {
  const corpus = badPayloadCorpus(vanDevice.id, Date.now());
  const countsBefore = node.server.ingest.stats().refusals[vanDevice.id] ?? {};
  const refusedBefore = refusalTotal();
  const rowsBefore = await rowCount();
  for (const entry of corpus)
    await van.publishAsync(readingsTopic(vanDevice.id), Buffer.from(entry.payload), { qos: 1 });
  const refusals = Object.fromEntries(
    Object.entries(node.server.ingest.stats().refusals[vanDevice.id] ?? {})
      .map(([code, n]) => [code, n - (countsBefore[code] ?? 0)])
      .filter(([, n]) => n !== 0),
  );
  const intended = corpus.filter((e) => e.outcome !== 'stored');
  const expectedCounts: Record<string, number> = {};
  intended.forEach((e) => (expectedCounts[e.outcome] = (expectedCounts[e.outcome] ?? 0) + 1));
  console.log(
    `bad-input: MQTT corpus ${corpus.length} payloads, ${refusalTotal() - refusedBefore} refused: ${JSON.stringify(refusals)}`,
  );
  expect(refusals).toEqual(expectedCounts);
  const stored = corpus.flatMap((e) => e.readings ?? []);
  expect((await rowCount()) - rowsBefore).toBe(stored.length);
  const rows = await node.database.query<Record<string, number | null>>(
    `SELECT round(extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current, temperature,
       state_of_charge AS "stateOfCharge", power FROM readings WHERE device_id = :id AND measured_at IN (:times)`,
    {
      replacements: { id: vanDevice.id, times: stored.map((r) => new Date(r.measuredAt)) },
      type: QueryTypes.SELECT,
    },
  );
  const byTime = new Map(rows.map((r) => [r.measuredAt, r]));
  for (const r of stored)
    expect(byTime.get(r.measuredAt)).toEqual({
      stateOfCharge: null,
      power: null,
      ...r,
    });
  expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
});

it('counts every generated MQTT payload it cannot store, and the connection stays up', async () => {
  const payloads = fc.sample(
    fc.oneof(
      fc.uint8Array({ maxLength: 500 }),
      fc.string({ unit: 'binary', maxLength: 500 }).map((s) => Buffer.from(s)),
    ),
    300,
  );
  const refusedBefore = refusalTotal();
  const expectedRefusals = payloads.filter((p) => decode(p) !== 'stored').length;
  for (const payload of payloads)
    await van.publishAsync(readingsTopic(vanDevice.id), Buffer.from(payload), { qos: 1 });
  console.log(
    `bad-input: MQTT generated ${payloads.length} payloads, ${refusalTotal() - refusedBefore} refused`,
  );
  expect(refusalTotal() - refusedBefore).toBe(expectedRefusals);
  expect(van.connected).toBe(true);
});

function sendBody(route: GarbageRoute, path: string, body: string) {
  const call = request(node.baseUrl)[route.method](path).set('Content-Type', 'application/json');
  if (route.as !== 'anonymous') call.set('Authorization', `Bearer ${tokens[route.as]}`);
  return call.send(body);
}

it('answers garbage bodies on every body-taking route with a 4xx and an error code, never a 5xx', async () => {
  const figures: string[] = [];
  for (const route of GARBAGE_ROUTES) {
    const statuses: Record<number, number> = {};
    const note = (status: number) => (statuses[status] = (statuses[status] ?? 0) + 1);
    const params = fc.record({ systemId: pathParameter(vanSystemId), alertId: pathParameter(vanSystemId) });
    await fc.assert(
      fc.asyncProperty(params, garbageBody(route.keys), async (p, body) => {
        const response = await sendBody(route, route.path(p), JSON.stringify(body));
        note(response.status);
        expect(response.status).toBeGreaterThanOrEqual(400);
        expect(response.status).toBeLessThan(500);
        expect(typeof response.body.error?.code).toBe('string');
      }),
      { numRuns: 60 },
    );
    for (const raw of RAW_GARBAGE) {
      const response = await sendBody(
        route,
        route.path({ systemId: vanSystemId, alertId: vanSystemId }),
        raw,
      );
      note(response.status);
      expect([response.status, typeof response.body.error?.code]).toEqual([expect.any(Number), 'string']);
      expect(response.status >= 400 && response.status < 500).toBe(true);
    }
    figures.push(
      `${route.method.toUpperCase()} ${route.path({ systemId: ':id', alertId: ':alertId' })} ${JSON.stringify(statuses)}`,
    );
  }
  figures.forEach((f) => console.log(`bad-input: ${f}`));
  expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
});
